/** `tamis compare` and `tamis validate` end to end on the invented demo model and analyses. */
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COMPARISON_CSV_COLUMNS } from '../../src/report/comparisonReport.js';
import { ROOT, requireBuild, tamis } from './runTamis.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-compare-cli-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const MODEL = join(ROOT, 'data-demo', 'benchmark.model.yaml');

describe('tamis compare (end to end)', () => {
  beforeAll(requireBuild);

  it('prints efficiencies of every analysis at 8 and 13 TeV with the costliest requirement, and writes comparison.csv and .html', () => {
    const run = tamis(folder, 'compare', MODEL, '--analyses', join(ROOT, 'analyses'), '--energies', '8,13', '--events', '10000', '--workers', '2', '--out', 'cmp');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    for (const id of ['three-lepton-8tev', 'same-sign-8tev', 'three-lepton-13tev', 'same-sign-13tev']) expect(run.stdout).toMatch(new RegExp(`^${id} +(8|13) +`, 'm'));
    expect(run.stdout).toMatch(/costliest requirement/);
    expect(run.stdout).toMatch(/signal in the regions with no condition on a variable/);
    expect(readdirSync(join(folder, 'cmp')).sort()).toEqual(['comparison.csv', 'comparison.html']);
    expect(readFileSync(join(folder, 'cmp', 'comparison.csv'), 'utf8').split('\n')[0]!.split(',')).toEqual([...COMPARISON_CSV_COLUMNS]);
  });
});

describe('tamis validate (end to end)', () => {
  beforeAll(requireBuild);

  it('sets tamis beside the reference cut-flow of the 8 TeV three-lepton analysis and agrees within 20%', () => {
    const run = tamis(folder, 'validate', join(ROOT, 'analyses', 'three-lepton-8tev.yaml'), '--events', '40000', '--workers', '2');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/step +three leptons including taus +38\.79 /);
    expect(run.stdout).toMatch(/every line within ±20% of the reference/);
  });

  it('flags steps outside the tolerance and exits 1', () => {
    const analysis = readFileSync(join(ROOT, 'analyses', 'three-lepton-8tev.yaml'), 'utf8')
      .replace('- {step: three leptons including taus, events: 38.79}', '- {step: three leptons including taus, events: 77.58}')
      .replace('../data-demo/benchmark.model.yaml', join(ROOT, 'data-demo', 'benchmark.model.yaml'))
      .replace('detector: detectors/generic-8tev.yaml', `detector: ${join(ROOT, 'analyses', 'detectors', 'generic-8tev.yaml')}`);
    writeFileSync(join(folder, 'doubled.yaml'), analysis);
    const run = tamis(folder, 'validate', 'doubled.yaml', '--events', '20000', '--workers', '1');
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/three leptons including taus +77\.58 .* OUTSIDE ±20%/);
    expect(run.stdout).toMatch(/\d+ line\(s\) outside ±20% of the reference/);
  });

  it('refuses an analysis without a reference cut-flow', () => {
    const run = tamis(folder, 'validate', join(ROOT, 'analyses', 'same-sign-8tev.yaml'));
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/has no reference cut-flow/);
  });
});
