/**
 * `tamis generate` end to end, on the real binary (compiled by `npm test`'s
 * build step) and the invented demo model.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { readLheFile } from '../../src/generator/lhe/index.js';
import { expectConsistentEvent } from '../generator/decayTestUtils.js';

const root = join(import.meta.dirname, '..', '..');
const MODEL = join(root, 'data-demo', 'benchmark.model.yaml');
const folder = mkdtempSync(join(tmpdir(), 'tamis-generate-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function tamis(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(root, 'bin', 'tamis.js'), ...args], { encoding: 'utf8', cwd: folder });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('tamis generate (end to end)', () => {
  beforeAll(() => {
    if (!existsSync(join(root, 'dist', 'src', 'cli', 'index.js'))) {
      throw new Error('dist/ is missing: run `npm run build` (npm test does it) before the end-to-end tests');
    }
  });

  it('writes an LHE file that reads back, and a CSV of the same final-state particles; same seed, same bytes', async () => {
    const lhe = tamis('generate', MODEL, '--energy', '13', '--events', '1500', '--seed', '5', '--out', 'a.lhe');
    expect(lhe.stderr).toBe('');
    expect(lhe.status).toBe(0);
    expect(lhe.stdout).toMatch(/^generated 1500 events of doublet-benchmark at 13 TeV \(seed 5\): cross section [0-9.e+-]+ \+- [0-9.e+-]+ pb; wrote a\.lhe\n$/);
    let finals = 0;
    const result = await readLheFile(join(folder, 'a.lhe'), (record) => {
      expectConsistentEvent(record, 1e-8); // ten printed digits
      for (let i = 0; i < record.size; i++) if (record.status[i] === STATUS_FINAL) finals++;
    });
    expect(result.events).toBe(1500);
    expect(result.init.beamEnergies).toEqual([6500, 6500]);
    expect(result.init.processes.length).toBeGreaterThan(0);

    expect(tamis('generate', MODEL, '--events', '1500', '--seed', '5', '--out', 'b.lhe').status).toBe(0);
    expect(readFileSync(join(folder, 'b.lhe')).equals(readFileSync(join(folder, 'a.lhe')))).toBe(true);

    const csv = tamis('generate', MODEL, '--events', '1500', '--seed', '5', '--out', 'a.csv');
    expect(csv.status).toBe(0);
    const lines = readFileSync(join(folder, 'a.csv'), 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('event,index,pdg_id,mother,mother_pdg_id,px,py,pz,e,mass,pt,eta,phi');
    expect(lines.length - 1).toBe(finals);
    expect(lines.at(-1)!.startsWith('1499,')).toBe(true);
  });

  it('rejects bad options with one line and exit code 2, and writes nothing', () => {
    const cases: [string[], RegExp][] = [
      [['--events', 'many', '--out', 'x.lhe'], /^tamis: --events: expected a number, got "many"\n$/],
      [['--events', '0', '--out', 'x.lhe'], /^tamis: --events: must be >= 1, got 0\n$/],
      [['--energy', '0', '--out', 'x.lhe'], /^tamis: --energy: must be > 0 TeV, got 0\n$/],
      [['--seed', '-3', '--out', 'x.lhe'], /^tamis: --seed: must be >= 0, got -3\n$/],
      [['--out', 'x.root'], /^tamis: --out: the file name must end in \.lhe or \.csv, got "x\.root"\n$/],
      [[], /^tamis: --out: an output file is required/],
    ];
    for (const [args, message] of cases) {
      const run = tamis('generate', MODEL, ...args);
      expect(run.status).toBe(2);
      expect(run.stderr).toMatch(message);
    }
    expect(readdirSync(folder).filter((f) => f.startsWith('x.') || f.startsWith('.x.'))).toEqual([]);
  });

  it('a failing run (missing model, unwritable output) exits 1 and leaves no file', () => {
    const missing = tamis('generate', 'nowhere.model.yaml', '--out', 'y.lhe');
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/^tamis: nowhere\.model\.yaml/);
    writeFileSync(join(folder, 'plainfile'), 'not a folder');
    const blocked = tamis('generate', MODEL, '--events', '10', '--out', 'plainfile/y.lhe');
    expect(blocked.status).toBe(1);
    expect(blocked.stderr.split('\n')).toHaveLength(2); // one line and the final newline
    expect(readdirSync(folder).filter((f) => f.includes('y.lhe'))).toEqual([]);
  });

  it('an interrupted run leaves neither the file nor a temporary piece of it', async () => {
    const child = spawn(process.execPath, [join(root, 'bin', 'tamis.js'), 'generate', MODEL, '--events', '5000000', '--out', 'big.lhe'], { cwd: folder, stdio: 'ignore' });
    // Wait until the temporary file exists, so the signal arrives while events are being written.
    for (let k = 0; k < 600 && !readdirSync(folder).some((f) => f.startsWith('.big.lhe')); k++) await new Promise((r) => setTimeout(r, 100));
    child.kill('SIGTERM');
    const [code, signal] = await new Promise<[number | null, string | null]>((resolve) => child.on('exit', (c, s) => resolve([c, s])));
    expect(code === 0 && signal === null).toBe(false);
    expect(readdirSync(folder).filter((f) => f.includes('big.lhe'))).toEqual([]);
  });
});
