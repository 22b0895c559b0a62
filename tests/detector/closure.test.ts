/**
 * Closure of the detector against its own profile: samples with known object
 * content, one bin of a table at a time, give back the tabulated efficiencies,
 * rates and resolution widths within their statistical errors.
 *
 * Statistics: in each bin the observed count is binomial around the tabulated
 * probability; pulls are combined into a chi-square with one degree of freedom
 * per bin (bins with p = 0 or 1 must match exactly). A correct detector fails
 * the p-value > 1e-3 requirement with probability 1e-3 per table, and the
 * |pull| < 4.5 requirement with probability ~1e-4 per table; the seeds are
 * fixed, so the outcome is reproducible.
 */
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createDetector } from '../../src/detector/detector.js';
import type { EfficiencyTable } from '../../src/detector/efficiencyTable.js';
import { builtInDetectorProfileNames, findDetectorProfile } from '../../src/detector/profile/builtInProfiles.js';
import type { DetectorProfile } from '../../src/detector/profile/detectorProfile.js';
import { RecoEvent } from '../../src/detector/recoEvent.js';
import { EventRecord, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { RandomStream } from '../../src/physics/random.js';
import { expectClose } from '../helpers.js';
import { addBeams, addHadronicTau, addParticle } from './eventBuilders.js';
import { PROFILE_8TEV, constantTable } from './profileVariants.js';

/** Objects per event, spread in phi by more than the jet radius so that no two merge. */
const PER_EVENT = 10;
const EVENTS_PER_BIN = 1000;

type Kind = 'electron' | 'muon' | 'tau' | 'quark' | 'b' | 'c';

/** Fills `record` with PER_EVENT objects of `kind` drawn uniformly in the bin [ptLow, ptHigh) x [etaLow, etaHigh) of |eta|. */
function fillEvent(record: EventRecord, kind: Kind, ptLow: number, ptHigh: number, etaLow: number, etaHigh: number, rng: RandomStream): void {
  record.clear();
  addBeams(record);
  for (let k = 0; k < PER_EVENT; k++) {
    const pt = rng.uniformIn(ptLow, ptHigh);
    const eta = (rng.uniform() < 0.5 ? -1 : 1) * rng.uniformIn(etaLow, etaHigh);
    const phi = -Math.PI + (2 * Math.PI * k) / PER_EVENT + 0.05 * rng.uniform();
    const sign = rng.uniform() < 0.5 ? -1 : 1;
    if (kind === 'tau') addHadronicTau(record, 15 * sign, pt, eta, phi);
    else {
      const id = { electron: 11, muon: 13, quark: rng.uniform() < 0.5 ? 2 : 21, b: 5, c: 4 }[kind];
      addParticle(record, sign * id, STATUS_FINAL, 0, pt, eta, phi);
    }
  }
}

/** Counts "passed" and "tried" objects in a reconstructed event. */
type Counter = (out: RecoEvent) => [passed: number, tried: number];

const countAll = (list: 'electrons' | 'muons'): Counter => (out) => [out[list].size, PER_EVENT];
const countTrueTaus: Counter = (out) => {
  let n = 0;
  for (let i = 0; i < out.taus.size; i++) if (Math.abs(out.taus.truthId[i]!) === 15) n++;
  return [n, PER_EVENT];
};
/** Among reconstructed jets (fakes included), the fraction identified as taus. */
const countFakeTaus: Counter = (out) => [out.taus.size, out.taus.size + out.jets.size];
/** Among reconstructed jets, the fraction b-tagged. */
const countTagged: Counter = (out) => {
  let tagged = 0;
  for (let i = 0; i < out.jets.size; i++) tagged += out.jets.tag[i]!;
  return [tagged, out.jets.size];
};

interface Closure {
  chiSquare: number;
  degrees: number;
  worstPull: number;
  exactMismatches: number;
}

/** Runs every bin of `table` through the detector and compares the observed fractions with it. */
function closure(profile: DetectorProfile, table: EfficiencyTable, kind: Kind, count: Counter, seed: number): Closure {
  const detector = createDetector(profile);
  const record = new EventRecord();
  const out = new RecoEvent();
  const rng = RandomStream.forStream(seed);
  const result: Closure = { chiSquare: 0, degrees: 0, worstPull: 0, exactMismatches: 0 };
  for (let i = 0; i < table.ptBins; i++) {
    const ptLow = table.ptEdges[i]!;
    const ptHigh = i + 1 < table.ptBins ? table.ptEdges[i + 1]! : 1.5 * table.ptEdges[i + 1]!; // the last row also covers the overflow
    for (let j = 0; j < table.etaBins; j++) {
      const p = table.values[i * table.etaBins + j]!;
      let passed = 0;
      let tried = 0;
      for (let e = 0; e < EVENTS_PER_BIN; e++) {
        fillEvent(record, kind, ptLow, ptHigh, table.absEtaEdges[j]!, table.absEtaEdges[j + 1]!, rng);
        detector.reconstruct(record, rng, out);
        const [a, b] = count(out);
        passed += a;
        tried += b;
      }
      if (p === 0 || p === 1) {
        if (passed !== p * tried) result.exactMismatches++;
        continue;
      }
      const pull = (passed - tried * p) / Math.sqrt(tried * p * (1 - p));
      result.chiSquare += pull * pull;
      result.degrees++;
      result.worstPull = Math.max(result.worstPull, Math.abs(pull));
    }
  }
  return result;
}

function expectClosure(c: Closure): void {
  expect(c.exactMismatches).toBe(0);
  expect(c.degrees).toBeGreaterThan(0);
  expect(1 - jStat.chisquare.cdf(c.chiSquare, c.degrees)).toBeGreaterThan(1e-3);
  expect(c.worstPull).toBeLessThan(4.5);
}

describe.each(builtInDetectorProfileNames().map((name) => findDetectorProfile(name)))('closure of the $name profile', (profile) => {
  it('electron identification efficiency in every (pT, |eta|) bin', () => {
    expectClosure(closure(profile, profile.electrons.efficiency, 'electron', countAll('electrons'), 1));
  });
  it('muon identification efficiency in every bin', () => {
    expectClosure(closure(profile, profile.muons.efficiency, 'muon', countAll('muons'), 2));
  });
  it('hadronic tau identification efficiency in every bin', () => {
    expectClosure(closure(profile, profile.taus.efficiency, 'tau', countTrueTaus, 3));
  });
  it('jet -> tau fake rate in every bin', () => {
    expectClosure(closure(profile, profile.taus.jetFakeRate, 'quark', countFakeTaus, 4));
  });
  it('b-tagging efficiency and c, light and tau mistag rates in every bin', () => {
    const noFakes = { ...profile, taus: { ...profile.taus, jetFakeRate: constantTable(0) } };
    expectClosure(closure(noFakes, profile.bTagging.b, 'b', countTagged, 5));
    expectClosure(closure(noFakes, profile.bTagging.c, 'c', countTagged, 6));
    expectClosure(closure(noFakes, profile.bTagging.light, 'quark', countTagged, 7));
    const tausAsJets = { ...noFakes, taus: { ...noFakes.taus, efficiency: constantTable(0) } };
    expectClosure(closure(tausAsJets, profile.bTagging.tau, 'tau', countTagged, 8));
  });
  it('electron charge-flip rate in every |eta| bin', () => {
    const flip = profile.electrons.chargeFlip;
    const detector = createDetector(profile);
    const record = new EventRecord();
    const out = new RecoEvent();
    const rng = RandomStream.forStream(9);
    for (let j = 0; j < flip.bins; j++) {
      const p = flip.values[j]!;
      let flipped = 0;
      let found = 0;
      // About 100 expected flips per bin (1e6 electrons at 1e-4); the rate is constant inside a bin,
      // so one event is reused for 50 reconstructions.
      const events = Math.min(100_000, Math.ceil(100 / (p * PER_EVENT * 0.8)));
      for (let e = 0; e < events; e++) {
        if (e % 50 === 0) fillEvent(record, 'electron', 40, 60, flip.absEtaEdges[j]!, flip.absEtaEdges[j + 1]!, rng);
        detector.reconstruct(record, rng, out);
        found += out.electrons.size;
        for (let i = 0; i < out.electrons.size; i++) flipped += out.electrons.tag[i]!;
      }
      expect(Math.abs((flipped - found * p) / Math.sqrt(found * p * (1 - p)))).toBeLessThan(4);
    }
  });
});

describe('resolution widths of the generic 8 TeV-era profile', () => {
  const profile = { ...PROFILE_8TEV, taus: { ...PROFILE_8TEV.taus, jetFakeRate: constantTable(0) } };
  const detector = createDetector(profile);

  /** Standard deviation of pT(reconstructed) / pT(true) for objects of `kind` at fixed pT and |eta|. */
  function measuredWidth(kind: Kind, pt: number, absEta: number, list: 'electrons' | 'muons' | 'taus' | 'jets'): number {
    const record = new EventRecord();
    const out = new RecoEvent();
    const rng = RandomStream.forStream(10, pt, Math.round(100 * absEta));
    let sum = 0;
    let sum2 = 0;
    let n = 0;
    for (let e = 0; e < 5000; e++) {
      fillEvent(record, kind, pt, pt, absEta, absEta, rng);
      detector.reconstruct(record, rng, out);
      for (let i = 0; i < out[list].size; i++) {
        const r = out[list].pt[i]! / pt;
        sum += r;
        sum2 += r * r;
        n++;
      }
    }
    const mean = sum / n;
    return Math.sqrt((sum2 / n - mean * mean) * (n / (n - 1)));
  }
  /** The profile's formula written out: sqrt((N/X)^2 + S^2/X + C^2 + (L X)^2). */
  const formula = (noise: number, stochastic: number, constant: number, linear: number, x: number): number => Math.sqrt((noise / x) ** 2 + stochastic ** 2 / x + constant ** 2 + (linear * x) ** 2);
  // Jets carry the response tail: 2% of jets with 3 times the width, so the spread is sigma sqrt(0.98 + 0.02 * 9).
  const tail = Math.sqrt(0.98 + 0.02 * 9);

  it('jets follow the noise, stochastic and constant terms in each |eta| region', () => {
    expectClose(measuredWidth('quark', 100, 0.3, 'jets'), tail * formula(3.0, 1.0, 0.05, 0, 100 * Math.cosh(0.3)), { rel: 0.02 });
    expectClose(measuredWidth('quark', 50, 2.0, 'jets'), tail * formula(3.5, 1.1, 0.06, 0, 50 * Math.cosh(2.0)), { rel: 0.02 });
    expectClose(measuredWidth('quark', 40, 3.5, 'jets'), tail * formula(4.0, 1.3, 0.08, 0, 40 * Math.cosh(3.5)), { rel: 0.02 });
  });
  it('electrons follow the calorimeter terms, muons the tracker terms with their curvature term', () => {
    expectClose(measuredWidth('electron', 100, 0.2, 'electrons'), formula(0.3, 0.1, 0.007, 0, 100 * Math.cosh(0.2)), { rel: 0.02 });
    expectClose(measuredWidth('electron', 40, 1.5, 'electrons'), formula(0.5, 0.2, 0.02, 0, 40 * Math.cosh(1.5)), { rel: 0.02 });
    expectClose(measuredWidth('muon', 500, 0.5, 'muons'), formula(0, 0, 0.015, 1e-4, 500), { rel: 0.02 });
    expectClose(measuredWidth('muon', 200, 2.2, 'muons'), formula(0, 0, 0.035, 3.5e-4, 200), { rel: 0.02 });
  });
  it('hadronic taus follow their visible-energy resolution', () => {
    expectClose(measuredWidth('tau', 60, 0.5, 'taus'), formula(1.0, 0.6, 0.05, 0, 60 * Math.cosh(0.5)), { rel: 0.02 });
  });
});
