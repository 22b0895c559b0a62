/**
 * `tamis scan` and `tamis merge` end to end: the files of a scan, a killed
 * scan resumed to the same scan.csv, shards merged to the same scan.csv, and
 * located errors in scan files.
 */
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SCAN_CSV_COLUMNS, MASS_LIMIT_CSV_COLUMNS } from '../../src/recast/scan/scanTables.js';
import { ROOT, requireBuild, startTamis, tamis } from './runTamis.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-scan-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const SCAN = join(ROOT, 'tests', 'fixtures', 'small.scan.yaml');
const read = (...parts: string[]) => readFileSync(join(folder, ...parts), 'utf8');

async function waitFor(condition: () => boolean, seconds: number): Promise<void> {
  const until = Date.now() + seconds * 1000;
  while (!condition()) {
    if (Date.now() > until) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('tamis scan (end to end)', () => {
  beforeAll(requireBuild);

  it('runs every point and writes scan.csv, mass_limits.csv, plots and the report', () => {
    const run = tamis(folder, 'scan', SCAN, '--out', 'full', '--workers', '2');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/small-test-scan: 6 points x 1 energies, 2000 events each; 6 computed now, 0 resumed/);
    expect(run.stdout).toMatch(/three-lepton-8tev +8 /);
    const files = readdirSync(join(folder, 'full')).sort();
    expect(files).toEqual(['cut_blame.svg', 'efficiency.svg', 'exclusion.svg', 'mass_limits.csv', 'points', 'report.html', 'scan.csv', 'scan.json']);
    const rows = read('full', 'scan.csv').trim().split('\n');
    expect(rows[0]!.split(',')).toEqual(['mass', ...SCAN_CSV_COLUMNS]);
    expect(rows).toHaveLength(1 + 6 * 2); // 6 points x 2 analyses
    expect(read('full', 'mass_limits.csv').split('\n')[0]!.split(',')).toEqual([...MASS_LIMIT_CSV_COLUMNS]);
  });

  it('resumes a killed scan where it stopped and gives the same scan.csv; no file is ever half-written', async () => {
    const child = startTamis(folder, 'scan', SCAN, '--out', 'killed', '--workers', '1');
    const points = join(folder, 'killed', 'points');
    const finished = () => (existsSync(points) ? readdirSync(points).filter((f) => f.endsWith('.json') && !f.startsWith('.')).length : 0);
    await waitFor(() => finished() >= 2, 120);
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    const kept = finished();
    expect(kept).toBeGreaterThanOrEqual(2);
    expect(existsSync(join(folder, 'killed', 'scan.csv'))).toBe(false);
    // Every checkpoint under its final name is complete.
    for (const name of readdirSync(points).filter((f) => f.endsWith('.json') && !f.startsWith('.'))) {
      expect(() => JSON.parse(readFileSync(join(points, name), 'utf8'))).not.toThrow();
    }
    const resumed = tamis(folder, 'scan', SCAN, '--out', 'killed', '--workers', '2');
    expect(resumed.status).toBe(0);
    expect(resumed.stdout).toMatch(new RegExp(`${6 - kept} computed now, ${kept} resumed from checkpoints`));
    expect(read('killed', 'scan.csv')).toBe(read('full', 'scan.csv'));
    expect(read('killed', 'mass_limits.csv')).toBe(read('full', 'mass_limits.csv'));
  }, 180_000);

  it('runs shards k/N and merges them into the same scan.csv as the whole scan', () => {
    const first = tamis(folder, 'scan', SCAN, '--out', 'shard1', '--shard', '1/2', '--workers', '1');
    expect(first.status).toBe(0);
    expect(first.stdout).toMatch(/shard 1\/2 done/);
    expect(existsSync(join(folder, 'shard1', 'scan.csv'))).toBe(false);
    const missing = tamis(folder, 'merge', 'shard1', '--out', 'merged');
    expect(missing.status).not.toBe(0);
    expect(missing.stderr).toMatch(/the folders lack scan points 1, 3, 5/);
    const second = tamis(folder, 'scan', SCAN, '--out', 'shard2', '--shard', '2/2', '--workers', '1');
    expect(second.status).toBe(0);
    const merged = tamis(folder, 'merge', 'shard1', 'shard2', '--out', 'merged');
    expect(merged.stderr).toBe('');
    expect(merged.status).toBe(0);
    expect(merged.stdout).toMatch(/merged 6 points from 2 folder\(s\)/);
    expect(read('merged', 'scan.csv')).toBe(read('full', 'scan.csv'));
  });

  it('refuses to mix checkpoints of another scan unless --fresh', () => {
    const other = join(folder, 'other.scan.yaml');
    writeFileSync(other, readFileSync(SCAN, 'utf8').replace('seed: 7', 'seed: 8').replace(/\.\.\/\.\.\//g, `${ROOT}/`));
    const refused = tamis(folder, 'scan', other, '--out', 'full');
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/points of a scan made from other inputs.*--fresh/);
  });

  it('names the scan file, line, column and key of a bad model path or formula', () => {
    const bad = join(folder, 'bad.scan.yaml');
    const text = readFileSync(SCAN, 'utf8').replace(/\.\.\/\.\.\//g, `${ROOT}/`);
    writeFileSync(bad, text.replace('particles.S+.mass', 'particles.S9.mass'));
    let run = tamis(folder, 'scan', bad, '--out', 'bad');
    expect(run.status).not.toBe(0);
    expect(run.stderr).toMatch(/bad\.scan\.yaml:\d+:\d+: parameters\[0\]\.set\[0\]: the model has no entry "S9" at particles \(entries: S\+, S0\)/);
    writeFileSync(bad, text.replace('formula: mass / ratio', 'formula: mass / rato'));
    run = tamis(folder, 'scan', bad, '--out', 'bad');
    expect(run.stderr).toMatch(/bad\.scan\.yaml:\d+:\d+: derived\[0\]\.formula: unknown parameter "rato"/);
    expect(existsSync(join(folder, 'bad'))).toBe(false);
  });
});

describe('scan files that set one value twice', () => {
  it('are refused with the key of the second setting', () => {
    const bad = join(folder, 'twice.scan.yaml');
    const text = readFileSync(SCAN, 'utf8').replace(/\.\.\/\.\.\//g, `${ROOT}/`).replace('set: [resonances.V0.mass, resonances.V+.mass]', 'set: [resonances.V0.mass, particles.S+.mass]');
    writeFileSync(bad, text);
    const run = tamis(folder, 'check', bad);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/twice\.scan\.yaml:\d+:\d+: derived\[0\]\.set\[1\]: particles\.S\+\.mass is set twice/);
  });
});
