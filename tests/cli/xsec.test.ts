/**
 * `tamis xsec` end to end, on the real binary (compiled by `npm test`'s build
 * step) and the invented demo models.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const MODEL = join(root, 'data-demo', 'benchmark.model.yaml');
const folder = mkdtempSync(join(tmpdir(), 'tamis-xsec-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function tamis(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(root, 'bin', 'tamis.js'), ...args], { encoding: 'utf8', cwd: folder });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

let plainRun: ReturnType<typeof tamis> | undefined;
/** `tamis xsec MODEL --energy 13 --json`, run once and shared by the tests. */
function plainJsonRun(): ReturnType<typeof tamis> {
  plainRun ??= tamis('xsec', MODEL, '--energy', '13', '--json');
  return plainRun;
}

describe('tamis xsec (end to end)', () => {
  beforeAll(() => {
    if (!existsSync(join(root, 'dist', 'src', 'cli', 'index.js'))) {
      throw new Error('dist/ is missing: run `npm run build` (npm test does it) before the end-to-end tests');
    }
  });

  it('prints one JSON object with exactly the documented keys, consistent with itself', () => {
    const run = plainJsonRun();
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout) as Record<string, unknown>;
    expect(Object.keys(json)).toEqual(['energy_tev', 'sigma_pb', 'error_pb', 'scale_band_pb', 'channels']);
    expect(json['energy_tev']).toBe(13);
    const channels = json['channels'] as { name: string; sigma_pb: number; error_pb: number; k_factor: number }[];
    expect(channels.map((c) => c.name)).toEqual(['charged_pair', 'neutral_pair', 'mixed_pair']);
    const total = channels.reduce((s, c) => s + c.sigma_pb, 0);
    expect(Math.abs((json['sigma_pb'] as number) - total)).toBeLessThan(1e-12 * total);
    const [low, high] = json['scale_band_pb'] as [number, number];
    expect(low).toBeLessThanOrEqual(total);
    expect(high).toBeGreaterThanOrEqual(total);
    // 0.5% target per channel (the default --precision)
    expect((json['error_pb'] as number) / total).toBeLessThanOrEqual(0.005);
    for (const c of channels) expect(c.k_factor).toBe(1);
  });

  it('prints a table with the K-factor beside every channel and the total with its scale band; same seed, same output', () => {
    const first = tamis('xsec', MODEL, '--energy', '8', '--seed', '4');
    expect(first.status).toBe(0);
    expect(first.stdout).toMatch(/^doublet-benchmark at sqrt\(s\) = 8 TeV, leading order/);
    expect(first.stdout).toMatch(/channel +sigma \[pb\] +MC error \[pb\] +K-factor +scale band \[pb\] +mu_F = mu_R/);
    expect(first.stdout).toMatch(/\ncharged_pair +[0-9.e-]+ +[0-9.e-]+ +1\.00 +[0-9.e-]+ - [0-9.e-]+ +300 GeV\n/);
    expect(first.stdout).toMatch(/\ntotal +[0-9.e-]+ +[0-9.e-]+ +[0-9.e-]+ - [0-9.e-]+\n/);
    const second = tamis('xsec', MODEL, '--energy', '8', '--seed', '4');
    expect(second.stderr).toBe('');
    expect(second.stdout).toBe(first.stdout);
  });

  it('prints a K-factor written in the model file and applies it', () => {
    const text = readFileSync(MODEL, 'utf8').replace('    through: [W, V+]\n', '    through: [W, V+]\n    k_factor: 1.3\n');
    writeFileSync(join(folder, 'k.model.yaml'), text);
    const plain = JSON.parse(plainJsonRun().stdout) as { channels: { sigma_pb: number; k_factor: number }[] };
    const scaled = JSON.parse(tamis('xsec', 'k.model.yaml', '--json').stdout) as { channels: { sigma_pb: number; k_factor: number }[] };
    expect(scaled.channels[2]!.k_factor).toBe(1.3);
    expect(Math.abs(scaled.channels[2]!.sigma_pb / plain.channels[2]!.sigma_pb - 1.3)).toBeLessThan(1e-12);
    expect(tamis('xsec', 'k.model.yaml').stdout).toMatch(/\nmixed_pair +[0-9.e-]+ +[0-9.e-]+ +1\.30 /);
  });

  it('rejects bad options and bad model files with one located line and a non-zero exit', () => {
    const badEnergy = tamis('xsec', MODEL, '--energy', 'high');
    expect(badEnergy.status).toBe(2);
    expect(badEnergy.stderr).toBe('tamis: --energy: expected a number, got "high"\n');
    const badPrecision = tamis('xsec', MODEL, '--precision', '2');
    expect(badPrecision.status).toBe(2);
    expect(badPrecision.stderr).toMatch(/^tamis: --precision: must be <= 0.5, got 2\n$/);
    writeFileSync(join(folder, 'bad.model.yaml'), readFileSync(MODEL, 'utf8').replace('branching: 0.45', 'branching: 0.35'));
    const badFile = tamis('xsec', 'bad.model.yaml');
    expect(badFile.status).toBe(1);
    expect(badFile.stdout).toBe('');
    expect(badFile.stderr).toMatch(/^tamis: bad\.model\.yaml:\d+:\d+: decays\[0\]\.modes: branching fractions of S\+ sum to 0\.9000000000, not 1/);
    const missing = tamis('xsec', 'none.model.yaml');
    expect(missing.status).toBe(1);
    expect(missing.stderr).toBe('tamis: none.model.yaml: file not found\n');
  });
});
