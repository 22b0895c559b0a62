/** `tamis demo` end to end: the invented scenario through the four invented analyses, every file written. */
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { requireBuild, tamis } from './runTamis.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-demo-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('tamis demo (end to end)', () => {
  beforeAll(requireBuild);

  it('scans at least 30 masses at 8 and 13 TeV, prints the mass limits per analysis and energy, and writes the report', () => {
    const run = tamis(folder, 'demo', '--out', 'demo', '--workers', '2');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/invented scenario through four invented analyses/);
    expect(run.stdout).toMatch(/mass limits of doublet-mass-scan \((\d+) points/);
    expect(Number(/\((\d+) points/.exec(run.stdout)![1])).toBeGreaterThanOrEqual(30);
    for (const [id, energy] of [['three-lepton-8tev', 8], ['same-sign-8tev', 8], ['three-lepton-13tev', 13], ['same-sign-13tev', 13]] as const) {
      expect(run.stdout).toMatch(new RegExp(`^${id} +${energy} +(not excluded|[0-9.]+ GeV\\+?) +(not excluded|[0-9.]+ GeV\\+?)$`, 'm'));
    }
    expect(run.stdout).toMatch(/report: .*demo[\\/]report\.html/);
    const files = readdirSync(join(folder, 'demo'));
    for (const name of ['report.html', 'scan.csv', 'mass_limits.csv', 'exclusion.svg', 'efficiency.svg', 'comparison.html', 'comparison.csv']) expect(files).toContain(name);
    const rows = readFileSync(join(folder, 'demo', 'scan.csv'), 'utf8').trim().split('\n');
    expect(rows.length - 1).toBeGreaterThanOrEqual(30 * 4);
  }, 300_000);
});
