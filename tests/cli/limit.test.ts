/**
 * `tamis limit` end to end, on the real binary (compiled by `npm test`'s build step).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectClose } from '../helpers.js';

const root = join(import.meta.dirname, '..', '..');
const folder = mkdtempSync(join(tmpdir(), 'tamis-limit-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function tamis(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(root, 'bin', 'tamis.js'), 'limit', ...args], { encoding: 'utf8', cwd: folder });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('tamis limit (end to end)', () => {
  beforeAll(() => {
    if (!existsSync(join(root, 'dist', 'src', 'cli', 'index.js'))) {
      throw new Error('dist/ is missing: run `npm run build` (npm test does it) before the end-to-end tests');
    }
  });

  it('--json prints one object with the keys scripts rely on (PDG: n = 1, b = 0 gives 4.74 at 95% CL)', () => {
    const run = tamis('--observed', '1', '--background', '0', '--json');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout);
    expect(Object.keys(json)).toEqual(['cl', 'method', 'observed_limit', 'expected_limit', 'cls_at_limit_error', 'toys']);
    expect(json.cl).toBe(0.95);
    expect(json.method).toBe('exact');
    expectClose(json.observed_limit, 4.74, { rel: 5e-3 });
    expect(Object.keys(json.expected_limit)).toEqual(['minus2', 'minus1', 'median', 'plus1', 'plus2']);
    expect(json.cls_at_limit_error).toBe(0);
  });

  it('prints a readable table, with the pseudo-experiment count and error for toys', () => {
    const exact = tamis('--observed', '3', '--background', '1.2');
    expect(exact.status).toBe(0);
    expect(exact.stdout).toMatch(/^95% CL CLs upper limits on signal events \(method: exact\)\n/);
    expect(exact.stdout).toMatch(/observed\s+expected\s+-2σ\s+-1σ\s+\+1σ\s+\+2σ/);
    expect(exact.stdout).toMatch(/\nevents\s+6\.605\s+4\.038\s+2\.996\s+2\.996\s+5\.271\s+7\.966\n$/);
    const toys = tamis('--observed', '3', '--background', '1.2', '--uncertainty', '0.4', '--seed', '5');
    expect(toys.status).toBe(0);
    expect(toys.stdout).toMatch(/\(method: toys\)/);
    expect(toys.stdout).toMatch(/\n\d+ pseudo-experiments \(seed 5\); CLs error at the observed limit [0-9.e-]+\n$/);
    expect(tamis('--observed', '3', '--background', '1.2', '--uncertainty', '0.4', '--seed', '5').stdout).toBe(toys.stdout);
  });

  it('honours --method, --cl, --signal-uncertainty and --uncertainty-model', () => {
    const base = ['--observed', '60', '--background', '55', '--uncertainty', '6', '--json'];
    const auto = JSON.parse(tamis(...base).stdout);
    expect(auto.method).toBe('asymptotic');
    expect(JSON.parse(tamis(...base, '--method', 'toys').stdout).method).toBe('toys');
    const ninety = JSON.parse(tamis(...base, '--cl', '0.9').stdout);
    expect(ninety.cl).toBe(0.9);
    expect(ninety.observed_limit).toBeLessThan(auto.observed_limit);
    expect(JSON.parse(tamis(...base, '--signal-uncertainty', '0.2').stdout).observed_limit).toBeGreaterThan(auto.observed_limit);
    expect(JSON.parse(tamis(...base, '--uncertainty-model', 'gaussian').stdout).observed_limit).not.toBe(auto.observed_limit);
  });

  it('--regions FILE.csv prints one row per region, the combination and the best-expected region', () => {
    writeFileSync(join(folder, 'sr.csv'), '# invented demo yields\nname,observed,background,uncertainty,group\nSR1,3,2.1,0.6,\nSR2,0,0.8,0.3,fakes\nSR3,12,9.5,2.1,fakes\n');
    const text = tamis('--regions', 'sr.csv');
    expect(text.stderr).toBe('');
    expect(text.status).toBe(0);
    const lines = text.stdout.trimEnd().split('\n');
    expect(lines[1]).toMatch(/^region\s+n\s+b\s+db\s+observed\s+expected/);
    expect(lines.slice(3, 6).map((l) => l.split(/\s+/)[0])).toEqual(['SR1', 'SR2', 'SR3']);
    expect(lines[6]).toMatch(/^combined \(mu\)\s+[0-9.]+/);
    expect(lines[7]).toMatch(/^best expected region: SR\d$/);
    const json = JSON.parse(tamis('--regions', 'sr.csv', '--json').stdout);
    expect(Object.keys(json)).toEqual(['cl', 'method', 'regions', 'combined', 'best_expected_region']);
    expect(json.regions.map((r: { name: string }) => r.name)).toEqual(['SR1', 'SR2', 'SR3']);
    expect(Object.keys(json.regions[0])).toEqual(expect.arrayContaining(['name', 'observed_limit', 'expected_limit']));
    expect(json.combined.observed_limit).toBeLessThan(Math.min(...json.regions.map((r: { observed_limit: number }) => r.observed_limit)));
  });

  it('bad options exit 2 with one line naming the option; bad CSV exits 1 naming file, line and column', () => {
    const cases: [string[], RegExp][] = [
      [['--observed', '-1', '--background', '2'], /^tamis: --observed: must be >= 0, got -1\n$/],
      [['--observed', '2.5', '--background', '2'], /^tamis: --observed: expected a whole number, got "2.5"\n$/],
      [['--observed', '2', '--background', 'abc'], /^tamis: --background: expected a number, got "abc"\n$/],
      [['--observed', '2', '--background', '2', '--cl', '1'], /^tamis: --cl: must be strictly between 0 and 1, got 1\n$/],
      [['--observed', '2', '--background', '2', '--method', 'bayes'], /^tamis: --method: expected one of exact, toys, asymptotic, auto, got "bayes"\n$/],
      [['--observed', '2', '--background', '2', '--uncertainty', '1', '--method', 'exact'], /^tamis: method: the exact method needs a known background/],
      [['--background', '2'], /^tamis: --observed: give --observed and --background/],
    ];
    for (const [args, message] of cases) {
      const run = tamis(...args);
      expect(run.status, args.join(' ')).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toMatch(message);
      expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
    }
    writeFileSync(join(folder, 'bad.csv'), 'name,observed,background,uncertainty\nSR1,3,2.1,0.6\nSR2,x,1,0\n');
    const bad = tamis('--regions', 'bad.csv');
    expect(bad.status).toBe(1);
    expect(bad.stderr).toBe('tamis: bad.csv:3:5: observed: expected a number, got "x"\n');
  });
});
