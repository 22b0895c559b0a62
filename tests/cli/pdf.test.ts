import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectClose } from '../helpers.js';

const root = join(import.meta.dirname, '..', '..');
const folder = mkdtempSync(join(tmpdir(), 'tamis-pdf-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** Runs the real binary (compiled by `npm test`'s build step). */
function tamis(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(root, 'bin', 'tamis.js'), ...args], { encoding: 'utf8', cwd: folder });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const KEYS = ['g', 'd', 'u', 's', 'c', 'b', 'dbar', 'ubar', 'sbar', 'cbar', 'bbar'];

describe('tamis pdf (end to end)', () => {
  beforeAll(() => {
    if (!existsSync(join(root, 'dist', 'src', 'cli', 'index.js'))) {
      throw new Error('dist/ is missing: run `npm run build` (npm test does it) before the end-to-end tests');
    }
  });

  it('prints a table with the densities name, Q, alpha_s and one row per x', () => {
    const run = tamis('pdf', '--x', '1e-4,0.01,0.1,0.5', '--q', '100');
    expect(run.status).toBe(0);
    const lines = run.stdout.trimEnd().split('\n');
    expect(lines[0]).toMatch(/LO toy densities \(Les Houches 2001 benchmark input/);
    expect(lines[1]).toBe('Q = 100 GeV, alpha_s(Q) = 0.12231');
    expect(lines[2]!.trim().split(/\s+/)).toEqual(['x', ...KEYS]);
    expect(lines).toHaveLength(3 + 4);
    const row = lines[5]!.trim().split(/\s+/).map(Number);
    expect(row[0]).toBe(0.1);
    // x g(0.1, Q = 100 GeV) = 0.84358 (hep-ph/0204316, Table 2), printed with 5 significant figures.
    expectClose(row[1]!, 0.84358, { rel: 2e-4 });
  });

  it('--json gives one object per (x, q) with the documented keys', () => {
    const run = tamis('pdf', '--x', '0.1,0.3', '--q', '100,1000', '--json');
    expect(run.status).toBe(0);
    const rows = JSON.parse(run.stdout) as { x: number; q: number; alpha_s: number; xf: Record<string, number> }[];
    expect(rows.map((r) => [r.x, r.q])).toEqual([[0.1, 100], [0.3, 100], [0.1, 1000], [0.3, 1000]]);
    for (const r of rows) {
      expect(Object.keys(r)).toEqual(['x', 'q', 'alpha_s', 'xf']);
      expect(Object.keys(r.xf)).toEqual(KEYS);
    }
    // alpha_s(10^4 GeV^2) = 0.1223055 (checks.md section 1); x u_v(0.3) = 0.37597 (Table 2).
    expectClose(rows[0]!.alpha_s, 0.1223055, { rel: 1e-6 });
    expectClose(rows[1]!.xf['u']! - rows[1]!.xf['ubar']!, 0.37597, { rel: 1e-3 });
  });

  it('rejects bad options with one line on stderr and exit code 2', () => {
    for (const [args, message] of [
      [['--x', '2'], /tamis: --x: must be in \(0, 1\), got 2/],
      [['--x', '0.1', '--q', 'abc'], /tamis: --q: expected a number, got "abc"/],
      [['--x', '0.1', '--q', '20000'], /tamis: --q: must be within the densities' range 1.4 to 10000 GeV, got 20000/],
      [[], /tamis: --x: a list of momentum fractions is required/],
      [['--x', '0,0.1'], /must be in \(0, 1\), got 0/],
    ] as const) {
      const run = tamis('pdf', ...args);
      expect(run.status, args.join(' ')).toBe(2);
      expect(run.stderr).toMatch(message);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
      expect(run.stdout).toBe('');
    }
  });

  it('--write-grid writes the CSV layout and --grid reads it back', () => {
    const file = join(folder, 'grid.csv');
    const written = tamis('pdf', '--write-grid', file);
    expect(written.status).toBe(0);
    expect(written.stderr).toMatch(/wrote .*grid\.csv: \d+ x values at \d+ q values/);
    expect(readFileSync(file, 'utf8').split('\n')[2]).toBe('x,q,g,d,u,s,c,b,dbar,ubar,sbar,cbar,bbar');
    const fromGrid = JSON.parse(tamis('pdf', '--grid', file, '--x', '0.01', '--q', '100', '--json').stdout);
    const builtIn = JSON.parse(tamis('pdf', '--x', '0.01', '--q', '100', '--json').stdout);
    for (const key of KEYS) expectClose(fromGrid[0].xf[key], builtIn[0].xf[key], { rel: 1e-8 }, key);
  });

  it('a malformed grid file gives a located error, exit code 1 and no output', () => {
    const bad = join(folder, 'bad.csv');
    tamis('pdf', '--write-grid', bad);
    const text = readFileSync(bad, 'utf8').split('\n');
    text[10] = text[10]!.replace(/,[^,]*$/, ',oops');
    writeFileSync(bad, text.join('\n'));
    const run = tamis('pdf', '--grid', bad, '--x', '0.1');
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/bad\.csv:11:\d+: bbar: not a number: "oops"/);
    expect(run.stdout).toBe('');
    expect(readdirSync(folder).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});
