/**
 * `tamis recast` end to end on the invented demo model and analyses: every
 * promised file, the documented CSV columns, byte-identical results for any
 * number of workers, and one-line errors for bad input.
 */
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CUTFLOW_CSV_COLUMNS, REGIONS_CSV_COLUMNS } from '../../src/report/recastTables.js';
import { ROOT, requireBuild, tamis } from './runTamis.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-recast-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const MODEL = join(ROOT, 'data-demo', 'benchmark.model.yaml');
const ANALYSES = [join(ROOT, 'analyses', 'three-lepton-8tev.yaml'), join(ROOT, 'analyses', 'same-sign-13tev.yaml')].join(',');

/** Column names listed in the README block that follows `marker`. */
function readmeColumns(marker: string): string[] {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const at = readme.indexOf(marker);
  expect(at, `README.md has no "${marker}"`).toBeGreaterThanOrEqual(0);
  const block = /```[a-z]*\n([^`]*)```/.exec(readme.slice(at))!;
  return block[1]!.trim().split(',');
}

describe('tamis recast (end to end)', () => {
  beforeAll(requireBuild);

  it('writes summary.json, regions.csv, cutflow.csv and report.html, prints the verdict table, exits 0', () => {
    const run = tamis(folder, 'recast', MODEL, '--analyses', ANALYSES, '--events', '20000', '--seed', '3', '--workers', '1', '--out', 'w1');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/three-lepton-8tev +8 +l\S+ .*(excluded|allowed)/);
    expect(run.stdout).toMatch(/same-sign-13tev +13 /);
    expect(run.stdout).toMatch(/confirm exclusions with the experiments/);
    expect(readdirSync(join(folder, 'w1')).sort()).toEqual(['cutflow.csv', 'regions.csv', 'report.html', 'summary.json']);
    const summary = JSON.parse(readFileSync(join(folder, 'w1', 'summary.json'), 'utf8'));
    expect(summary.settings.seed).toBe(3);
    expect(summary.inputs.model.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(summary.inputs.analyses).toHaveLength(2);
    expect(summary.result.energies.map((e: { energyTeV: number }) => e.energyTeV)).toEqual([8, 13]);
    expect(summary.tamis_version).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('writes the CSV columns the README documents', () => {
    const regions = readFileSync(join(folder, 'w1', 'regions.csv'), 'utf8').split('\n');
    expect(regions[0]!.split(',')).toEqual([...REGIONS_CSV_COLUMNS]);
    expect(readmeColumns('regions.csv columns')).toEqual([...REGIONS_CSV_COLUMNS]);
    // one row per region of the two analyses (36 + 6) plus the header and a final newline
    expect(regions.length).toBe(1 + 36 + 6 + 1);
    const cutflow = readFileSync(join(folder, 'w1', 'cutflow.csv'), 'utf8').split('\n');
    expect(cutflow[0]!.split(',')).toEqual([...CUTFLOW_CSV_COLUMNS]);
    expect(readmeColumns('cutflow.csv columns')).toEqual([...CUTFLOW_CSV_COLUMNS]);
  });

  it('gives byte-identical regions.csv, cutflow.csv and summary.json with --workers 1 and --workers 2 (same seed)', () => {
    const run = tamis(folder, 'recast', MODEL, '--analyses', ANALYSES, '--events', '20000', '--seed', '3', '--workers', '2', '--out', 'w2');
    expect(run.status).toBe(0);
    for (const name of ['regions.csv', 'cutflow.csv']) {
      expect(readFileSync(join(folder, 'w2', name), 'utf8')).toBe(readFileSync(join(folder, 'w1', name), 'utf8'));
    }
    const strip = (text: string) => text.replace(/"command": "[^"]*"/, '');
    expect(strip(readFileSync(join(folder, 'w2', 'summary.json'), 'utf8'))).toBe(strip(readFileSync(join(folder, 'w1', 'summary.json'), 'utf8')));
  });

  it('changes the results with the seed', () => {
    const run = tamis(folder, 'recast', MODEL, '--analyses', ANALYSES, '--events', '20000', '--seed', '4', '--workers', '2', '--out', 'w3');
    expect(run.status).toBe(0);
    expect(readFileSync(join(folder, 'w3', 'regions.csv'), 'utf8')).not.toBe(readFileSync(join(folder, 'w1', 'regions.csv'), 'utf8'));
  });

  it('rejects bad input with one line and a non-zero exit, writing nothing', () => {
    const cases: [string[], RegExp, number][] = [
      [['recast', MODEL, '--analyses', ANALYSES, '--events', 'many', '--out', 'bad1'], /--events: expected a number, got "many"/, 2],
      [['recast', MODEL, '--analyses', ANALYSES, '--energy', '14', '--out', 'bad2'], /no analysis at 14 TeV/, 2],
      [['recast', join(ROOT, 'missing.model.yaml'), '--analyses', ANALYSES, '--out', 'bad3'], /missing\.model\.yaml: file not found/, 1],
      [['recast', MODEL, '--analyses', join(ROOT, 'nowhere'), '--out', 'bad4'], /nowhere: file not found/, 1],
      [['recast', MODEL, '--analyses', ANALYSES, '--method', 'magic', '--out', 'bad5'], /--method: expected one of exact, toys, asymptotic, auto/, 2],
    ];
    for (const [args, message, code] of cases) {
      const run = tamis(folder, ...args);
      expect(run.status).toBe(code);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
      expect(run.stderr).toMatch(message);
      expect(readdirSync(folder)).not.toContain(args[args.length - 1]);
    }
  });
});

describe('tamis recast --events FILE.lhe (end to end)', () => {
  beforeAll(requireBuild);

  it('recasts the events of a Les Houches file with the cross section of its init block, or the one given', () => {
    const made = tamis(folder, 'generate', MODEL, '--energy', '8', '--events', '3000', '--seed', '9', '--out', 'sample.lhe');
    expect(made.status).toBe(0);
    const sigma = Number(/cross section ([0-9.e+-]+) \+-/.exec(made.stdout)![1]);
    const run = tamis(folder, 'recast', '--events', 'sample.lhe', '--analyses', join(ROOT, 'analyses'), '--out', 'lhe');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/3000 events from sample\.lhe/);
    expect(run.stdout).toMatch(/^three-lepton-8tev +8 /m);
    expect(run.stdout).not.toMatch(/13tev/);
    const summary = JSON.parse(readFileSync(join(folder, 'lhe', 'summary.json'), 'utf8'));
    expect(Math.abs(summary.result.energies[0].sigmaPb / sigma - 1)).toBeLessThan(1e-3); // printed with 4 digits
    const given = tamis(folder, 'recast', MODEL, '--events', 'sample.lhe', '--cross-section', '0.5', '--analyses', join(ROOT, 'analyses', 'three-lepton-8tev.yaml'), '--out', 'lhe2');
    expect(given.status).toBe(0);
    expect(given.stdout).toMatch(/^doublet-benchmark: 8 TeV: 0\.5000 pb/);
  });

  it('refuses an event file at another energy than every analysis, and a recast with neither model nor events', () => {
    const wrong = tamis(folder, 'recast', '--events', 'sample.lhe', '--analyses', join(ROOT, 'analyses', 'same-sign-13tev.yaml'), '--out', 'lhe3');
    expect(wrong.status).toBe(2);
    expect(wrong.stderr).toMatch(/sample\.lhe: the events are at 8 TeV but the analyses are at 13 TeV/);
    const nothing = tamis(folder, 'recast', '--analyses', join(ROOT, 'analyses'));
    expect(nothing.status).toBe(2);
    expect(nothing.stderr).toMatch(/give a model file to generate, or --events FILE\.lhe/);
  });
});
