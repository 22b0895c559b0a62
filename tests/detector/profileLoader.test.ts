import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtInDetectorFolder, builtInDetectorProfileNames, findDetectorProfile } from '../../src/detector/profile/builtInProfiles.js';
import { loadDetectorProfile, parseDetectorProfile } from '../../src/detector/profile/loader.js';
import { TamisError, formatError } from '../../src/errors.js';

const FILE = join(builtInDetectorFolder(), 'generic-8tev.yaml');
const TEXT = readFileSync(FILE, 'utf8');
const LINES = TEXT.split('\n');

/** 1-based line number of the first line containing `needle` after the first line containing `after`. */
function lineOf(needle: string, after = ''): number {
  const start = after === '' ? 0 : LINES.findIndex((l) => l.includes(after));
  const index = LINES.findIndex((l, i) => i >= start && l.includes(needle));
  if (index < 0) throw new Error(`no line contains ${needle}`);
  return index + 1;
}

/** The text with the first occurrence of `from` (after the line containing `after`) replaced by `to`. */
function edited(from: string, to: string, after = ''): string {
  const start = after === '' ? 0 : TEXT.indexOf(after);
  const at = TEXT.indexOf(from, start);
  if (at < 0) throw new Error(`no ${from} after ${after}`);
  return TEXT.slice(0, at) + to + TEXT.slice(at + from.length);
}

function errorOf(text: string): TamisError {
  try {
    parseDetectorProfile(text, 'bad.yaml');
  } catch (error) {
    if (error instanceof TamisError) return error;
    throw error;
  }
  throw new Error('expected the profile to be rejected');
}

describe('shipped detector profiles', () => {
  it('are the generic 8 TeV-era and 13 TeV-era profiles', () => {
    expect(builtInDetectorProfileNames()).toEqual(['generic-13tev', 'generic-8tev']);
    expect(findDetectorProfile('generic-8tev').colliderEnergyTev).toBe(8);
    expect(findDetectorProfile('generic-13tev').colliderEnergyTev).toBe(13);
  });
  it('load by path, relative to a folder, with the file recorded', () => {
    const profile = findDetectorProfile('generic-8tev.yaml', builtInDetectorFolder());
    expect(profile.name).toBe('generic-8tev');
    expect(profile.file).toBe(FILE);
    expect(loadDetectorProfile(FILE).jets.minPt).toBe(15);
  });
  it('keep every value inside the common-practice ranges of shared/checks.md section 5', () => {
    for (const name of builtInDetectorProfileNames()) {
      const p = findDetectorProfile(name);
      // electrons 60-90% rising with pT (the barrel-endcap transition column is allowed lower)
      const e = p.electrons.efficiency;
      for (let i = 0; i < e.ptBins; i++) {
        for (let j = 0; j < e.etaBins; j++) {
          const v = e.values[i * e.etaBins + j]!;
          expect(v).toBeLessThanOrEqual(0.9);
          if (e.absEtaEdges[j] !== 1.4) expect(v).toBeGreaterThanOrEqual(0.55);
          if (i > 0) expect(v).toBeGreaterThanOrEqual(e.values[(i - 1) * e.etaBins + j]!);
        }
      }
      for (const v of p.muons.efficiency.values) expect(v).toBeGreaterThanOrEqual(0.88), expect(v).toBeLessThanOrEqual(0.98);
      for (const v of p.taus.efficiency.values) expect(v).toBeGreaterThanOrEqual(0.4), expect(v).toBeLessThanOrEqual(0.6);
      for (const v of p.taus.jetFakeRate.values) expect(v).toBeGreaterThanOrEqual(0.005), expect(v).toBeLessThanOrEqual(0.02);
      for (const v of p.bTagging.b.values) expect(v).toBeGreaterThanOrEqual(0.55), expect(v).toBeLessThanOrEqual(0.77);
      for (const v of p.bTagging.c.values) expect(v).toBeGreaterThanOrEqual(0.15), expect(v).toBeLessThanOrEqual(0.22);
      for (const v of p.bTagging.light.values) expect(v).toBeGreaterThanOrEqual(0.004), expect(v).toBeLessThanOrEqual(0.02);
      // charge flip ~1e-4 central to ~1e-2 forward
      expect(p.electrons.chargeFlip.at(0)).toBe(1e-4);
      expect(p.electrons.chargeFlip.at(2.4)).toBe(1e-2);
      // jet energy resolution ~100%/sqrt(E) (+) 5%: 11.2% at 100 GeV; the profiles add a few GeV of noise
      const jer = p.jets.resolution.table.relativeWidth(100, 0);
      expect(jer).toBeGreaterThan(0.112);
      expect(jer).toBeLessThan(0.125);
    }
  });
  it('differ plausibly between eras: better b-tagging and tau identification, more pile-up at 13 TeV', () => {
    const p8 = findDetectorProfile('generic-8tev');
    const p13 = findDetectorProfile('generic-13tev');
    expect(p13.bTagging.b.probability(100, 0)).toBeGreaterThan(p8.bTagging.b.probability(100, 0));
    expect(p13.bTagging.light.probability(100, 0)).toBeLessThan(p8.bTagging.light.probability(100, 0));
    expect(p13.taus.efficiency.probability(50, 0)).toBeGreaterThan(p8.taus.efficiency.probability(50, 0));
    expect(p13.softTerm.constant).toBeGreaterThan(p8.softTerm.constant);
  });
});

describe('detector profile errors name file, line and key', () => {
  it('bin edges that do not increase', () => {
    const e = errorOf(edited('pt_edges: [7, 10, 15,', 'pt_edges: [7, 10, 9,'));
    expect(e.key).toBe('electrons.efficiency.pt_edges[2]');
    expect(e.line).toBe(lineOf('pt_edges: [7, 10, 15,'));
    expect(e.message).toBe('bin edges must increase strictly, but 9 follows 10');
    expect(formatError(e)).toMatch(/^bad\.yaml:\d+:\d+: electrons\.efficiency\.pt_edges\[2\]: /);
  });
  it('a table with the wrong number of rows', () => {
    const e = errorOf(edited('      - [0.90, 0.88, 0.74, 0.86, 0.82]   # above 60 GeV\n', ''));
    expect(e.key).toBe('electrons.efficiency.values');
    expect(e.message).toBe('expected 7 rows x 5 columns (one row per pt bin of pt_edges, one column per |eta| bin of abs_eta_edges), got 6 rows');
    expect(e.line).toBe(lineOf('- [0.62, 0.60'));
  });
  it('a row with the wrong number of columns', () => {
    const e = errorOf(edited('[0.96, 0.95, 0.93]', '[0.96, 0.95]'));
    expect(e.key).toBe('muons.efficiency.values[2]');
    expect(e.line).toBe(lineOf('[0.96, 0.95, 0.93]'));
    expect(e.message).toMatch(/^expected 5 rows x 3 columns .*got 2 values in row 3$/);
  });
  it('a probability above 1', () => {
    const e = errorOf(edited('[0.42, 0.40]', '[1.42, 0.40]'));
    expect(e.key).toBe('taus.efficiency.values[0][0]');
    expect(e.line).toBe(lineOf('[0.42, 0.40]'));
    expect(e.message).toBe('must be <= 1, got number 1.42');
  });
  it('a negative resolution term', () => {
    const e = errorOf(edited('stochastic: [1.0, 1.1, 1.3]', 'stochastic: [1.0, -1.1, 1.3]'));
    expect(e.key).toBe('jets.resolution.stochastic[1]');
    expect(e.line).toBe(lineOf('stochastic: [1.0, 1.1, 1.3]'));
    expect(e.message).toBe('must be >= 0, got number -1.1');
  });
  it('a resolution term without one value per |eta| bin', () => {
    const e = errorOf(edited('noise: [3.0, 3.5, 4.0]', 'noise: [3.0, 3.5]'));
    expect(e.key).toBe('jets.resolution.noise');
    expect(e.message).toBe('expected 3 values (one per |eta| bin of abs_eta_edges), got 2');
  });
  it('a charge-flip table that does not start at |eta| = 0', () => {
    const e = errorOf(edited('abs_eta_edges: [0, 2.5]\n    values: [1.0e-5]', 'abs_eta_edges: [0.5, 2.5]\n    values: [1.0e-5]'));
    expect(e.key).toBe('muons.charge_flip.abs_eta_edges[0]');
    expect(e.message).toBe('the first |eta| edge must be 0, got 0.5');
  });
  it('a tracker measurement beyond the tracker coverage', () => {
    const e = errorOf(edited('abs_eta_edges: [0, 1.2, 2.5]', 'abs_eta_edges: [0, 1.2, 3.0]'));
    expect(e.key).toBe('b_tagging.b_efficiency.abs_eta_edges[2]');
    expect(e.message).toMatch(/beyond the tracker coverage 2\.5/);
  });
  it('a tracker wider than the calorimeters, and jets beyond the calorimeters', () => {
    expect(errorOf(edited('tracker_abs_eta: 2.5', 'tracker_abs_eta: 5.5')).key).toBe('acceptance.tracker_abs_eta');
    const e = errorOf(edited('abs_eta_max: 4.5', 'abs_eta_max: 5.2'));
    expect(e.key).toBe('jets.abs_eta_max');
    expect(e.line).toBe(lineOf('abs_eta_max: 4.5'));
  });
  it('an unknown key, with the nearest allowed one', () => {
    const e = errorOf(edited('response_tail:', 'response_tails:'));
    expect(e.message).toBe('unknown key "response_tails"');
    expect(e.key).toBe('jets.response_tails');
    // the error points at the misspelt key itself
    expect(e.line).toBe(lineOf('response_tail:'));
    expect(e.suggestion).toMatch(/did you mean "response_tail"\?/);
  });
  it('a missing key', () => {
    const e = errorOf(edited('  soft_term_stochastic: 0.5\n', ''));
    expect(e.key).toBe('missing_momentum.soft_term_stochastic');
    expect(e.message).toMatch(/^missing required key/);
    // located at the mapping that lacks the key (its first entry)
    expect(e.line).toBe(lineOf('soft_term_constant:'));
  });
  it('a value of the wrong type', () => {
    const e = errorOf(edited('min_pt: 15', 'min_pt: fifteen'));
    expect(e.key).toBe('jets.min_pt');
    expect(e.message).toBe('expected number, got string "fifteen"');
  });
  it('a measured quantity that is neither energy nor pt', () => {
    const e = errorOf(edited('measured: pt', 'measured: momentum'));
    expect(e.key).toBe('muons.resolution.measured');
    expect(e.message).toBe('expected one of "energy", "pt", got string "momentum"');
  });
  it('a missing file and an unknown profile name', () => {
    expect(() => loadDetectorProfile('no/such/profile.yaml')).toThrow(/file not found/);
    try {
      findDetectorProfile('generic-7tev');
      expect.fail('expected an error');
    } catch (error) {
      expect(error).toBeInstanceOf(TamisError);
      expect((error as TamisError).message).toBe('unknown detector profile "generic-7tev"');
      expect((error as TamisError).suggestion).toMatch(/generic-13tev, generic-8tev/);
    }
  });
});
