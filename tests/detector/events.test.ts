/**
 * Hand-built events with known answers through the parametrised detector.
 * Statistical checks use fixed seeds; a pull is (observed - expected) / its
 * binomial or Gaussian standard error, and |pull| < 4 is required (a
 * two-sided p-value of 6e-5 for a correct detector).
 */
import { describe, expect, it } from 'vitest';
import { createDetector } from '../../src/detector/detector.js';
import { EtaBinnedValues } from '../../src/detector/etaBinnedValues.js';
import { RecoEvent } from '../../src/detector/recoEvent.js';
import { TamisError } from '../../src/errors.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { M_TAU, M_Z } from '../../src/physics/constants.js';
import { pairMass } from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';
import { expectClose } from '../helpers.js';
import { addBeams, addHadronicTau, addParticle, topToBElectron, zToLeptons } from './eventBuilders.js';
import { PROFILE_8TEV, constantTable, perfectProfile } from './profileVariants.js';

function binomialPull(k: number, n: number, p: number): number {
  return (k - n * p) / Math.sqrt(n * p * (1 - p));
}

/** Sample mean and standard deviation. */
function meanAndSpread(values: readonly number[]): { mean: number; sd: number } {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const variance = values.reduce((a, b) => a + (b - mean) * (b - mean), 0) / (values.length - 1);
  return { mean, sd: Math.sqrt(variance) };
}

/** sigma_X/X of the profile formula, written out independently of ResolutionTable. */
function formulaWidth(noise: number, stochastic: number, constant: number, x: number): number {
  return Math.sqrt((noise / x) ** 2 + (stochastic * stochastic) / x + constant * constant);
}

const N = 20_000;

describe('Z -> e e with the generic 8 TeV-era profile', () => {
  const record = new EventRecord();
  zToLeptons(record, 11);
  const detector = createDetector(PROFILE_8TEV);
  const out = new RecoEvent();
  let both = 0;
  const masses: number[] = [];
  const mets: number[] = [];
  for (let k = 0; k < N; k++) {
    detector.reconstruct(record, RandomStream.forStream(101, k), out);
    mets.push(out.met);
    if (out.electrons.size === 2) {
      both++;
      masses.push(pairMass(out.electrons.momentum, 0, 1));
    }
  }
  // Both electrons have pT = 42.2 GeV and |eta| < 0.8: efficiency 0.88 each (profile table).
  it('finds both electrons with probability 0.88^2', () => {
    expect(Math.abs(binomialPull(both, N, 0.88 * 0.88))).toBeLessThan(4);
  });
  it('reproduces the Z mass with the width expected from the electron energy resolution', () => {
    const pt = M_Z / Math.sqrt(2 * (Math.cosh(0.8) + 1));
    // sigma_m / m = (1/2) sqrt(s1^2 + s2^2) for m^2 proportional to E1 E2 (error propagation)
    const s1 = formulaWidth(0.3, 0.1, 0.007, pt * Math.cosh(0.3));
    const s2 = formulaWidth(0.3, 0.1, 0.007, pt * Math.cosh(0.5));
    const expected = 0.5 * Math.hypot(s1, s2) * M_Z;
    const { mean, sd } = meanAndSpread(masses);
    expectClose(mean, M_Z, { abs: 4 * expected / Math.sqrt(masses.length) });
    expectClose(sd, expected, { rel: 0.03 });
  });
  it('has no neutrino yet a non-zero missing transverse momentum', () => {
    const { mean } = meanAndSpread(mets);
    expect(Math.min(...mets)).toBeGreaterThan(0);
    expect(mean).toBeGreaterThan(5);
  });
  it('gives each electron its true charge unless it is marked as flipped', () => {
    detector.reconstruct(record, RandomStream.forStream(5, 5), out);
    for (let k = 0; k < 2000; k++) {
      detector.reconstruct(record, RandomStream.forStream(102, k), out);
      for (let i = 0; i < out.electrons.size; i++) {
        const trueCharge = out.electrons.truthId[i]! > 0 ? -1 : 1;
        expect(out.electrons.charge[i]).toBe(out.electrons.tag[i] === 1 ? -trueCharge : trueCharge);
      }
    }
  });
});

describe('missing transverse momentum without invisible particles', () => {
  it('is the soft-term resolution alone when the muons are measured perfectly', () => {
    // Z -> mu mu, perfect muon resolution: metX and metY are Gaussian with the soft term's 8 GeV width
    // (generic-8tev soft_term_constant) whenever both muons are found; |MET| is then Rayleigh, mean 8 sqrt(pi/2).
    const profile = { ...perfectProfile(), softTerm: PROFILE_8TEV.softTerm };
    const detector = createDetector(profile);
    const record = new EventRecord();
    zToLeptons(record, 13);
    const out = new RecoEvent();
    const x: number[] = [];
    const met: number[] = [];
    for (let k = 0; k < N; k++) {
      detector.reconstruct(record, RandomStream.forStream(103, k), out);
      if (out.muons.size !== 2) continue;
      x.push(out.metX, out.metY);
      met.push(out.met);
    }
    const { mean, sd } = meanAndSpread(x);
    expectClose(mean, 0, { abs: 4 * 8 / Math.sqrt(x.length) });
    expectClose(sd, 8, { rel: 0.025 });
    expectClose(meanAndSpread(met).mean, 8 * Math.sqrt(Math.PI / 2), { rel: 0.025 });
  });
  it('adds the jet energy resolution of each jet to the soft term in quadrature', () => {
    // Two 100 GeV central jets, no tail: var(metX) = 8^2 + sum_j (sigma_j px_j)^2.
    const profile = { ...PROFILE_8TEV, jets: { ...PROFILE_8TEV.jets, tailFraction: 0 } };
    const detector = createDetector(profile);
    const record = new EventRecord();
    addBeams(record);
    addParticle(record, 2, STATUS_FINAL, 0, 100, 0.2, 0.4);
    addParticle(record, 21, STATUS_FINAL, 0, 100, -0.7, 0.4 + Math.PI);
    const px1 = 100 * Math.cos(0.4);
    const s1 = formulaWidth(3, 1, 0.05, 100 * Math.cosh(0.2));
    const s2 = formulaWidth(3, 1, 0.05, 100 * Math.cosh(0.7));
    const expected = Math.sqrt(64 + (s1 * px1) ** 2 + (s2 * px1) ** 2);
    const out = new RecoEvent();
    const x: number[] = [];
    for (let k = 0; k < N; k++) {
      detector.reconstruct(record, RandomStream.forStream(104, k), out);
      x.push(out.metX);
    }
    expectClose(meanAndSpread(x).sd, expected, { rel: 0.03 });
  });
  it('counts jets below the detector threshold in the soft term, and particles beyond the calorimeter as lost', () => {
    // A 10 GeV quark (below the 15 GeV jet threshold) recoils against a 10 GeV muon: measured in the
    // soft term, it balances the muon (MET = 0); beyond the calorimeter (|eta| 5.2 > 4.9) it is lost (MET = 10 GeV).
    const p = perfectProfile();
    const detector = createDetector({ ...p, muons: { ...p.muons, efficiency: constantTable(1) } });
    const record = new EventRecord();
    const out = new RecoEvent();
    for (const [eta, met] of [[0.5, 0], [5.2, 10]] as const) {
      record.clear();
      addBeams(record);
      addParticle(record, 13, STATUS_FINAL, 0, 10, 0.1, 1.0);
      addParticle(record, 1, STATUS_FINAL, 0, 10, eta, 1.0 - Math.PI);
      detector.reconstruct(record, RandomStream.forStream(1), out);
      expect(out.muons.size).toBe(1);
      expect(out.jets.size).toBe(0);
      expectClose(out.met, met, { abs: 1e-9 });
      if (met > 0) expectClose(out.metX, -10 * Math.cos(1.0), { rel: 1e-12 });
    }
  });
});

describe('a top-like decay t -> b W, W -> e nu', () => {
  const record = new EventRecord();
  topToBElectron(record);
  const detector = createDetector(PROFILE_8TEV);
  const out = new RecoEvent();
  let jets = 0;
  let tagged = 0;
  const metX: number[] = [];
  for (let k = 0; k < N; k++) {
    detector.reconstruct(record, RandomStream.forStream(105, k), out);
    metX.push(out.metX);
    for (let j = 0; j < out.jets.size; j++) {
      if (out.jets.truthId[j] !== 5) continue;
      jets++;
      tagged += out.jets.tag[j]!;
    }
  }
  it('tags the b jet (pT 80 GeV, |eta| 0.4) with the tabulated efficiency 0.72', () => {
    expect(Math.abs(binomialPull(tagged, jets, 0.72))).toBeLessThan(4);
    // the b jet is lost only when it fakes a tau (0.6% at 80 GeV)
    expect(Math.abs(binomialPull(N - jets, N, 0.006))).toBeLessThan(4);
  });
  it('measures on average the neutrino as missing momentum', () => {
    const expected = -(80 * Math.cos(1.2) + 45 * Math.cos(-1.0));
    const { mean, sd } = meanAndSpread(metX);
    expectClose(mean, expected, { abs: 4 * sd / Math.sqrt(N) });
  });
});

describe('hadronic taus', () => {
  it('are identified with the tau efficiency, with the tau charge, and otherwise become jets', () => {
    const record = new EventRecord();
    addBeams(record);
    addHadronicTau(record, 15, 50, 0.5, 0.3);
    const detector = createDetector(PROFILE_8TEV);
    const out = new RecoEvent();
    let found = 0;
    let flipped = 0;
    let asJets = 0;
    for (let k = 0; k < N; k++) {
      detector.reconstruct(record, RandomStream.forStream(106, k), out);
      expect(out.electrons.size + out.muons.size).toBe(0);
      if (out.taus.size === 1) {
        found++;
        expect(out.taus.truthId[0]).toBe(15);
        expect(out.taus.charge[0]).toBe(out.taus.tag[0] === 1 ? 1 : -1);
        flipped += out.taus.tag[0]!;
        expectClose(out.taus.eta[0]!, 0.5, { abs: 1e-12 });
      } else if (out.jets.size === 1) {
        expect(out.jets.truthId[0]).toBe(15);
        asJets++;
      }
    }
    // An unidentified tau is lost as a jet only when the jet-response tail pushes it below the
    // 15 GeV threshold: 2% x P(z < -1.8) x 48% ~ 3.5e-4 of the events.
    expect(N - found - asJets).toBeLessThan(20);
    // generic-8tev: tau identification 0.52 at 40-60 GeV, |eta| < 1.5; charge flip 1%
    expect(Math.abs(binomialPull(found, N, 0.52))).toBeLessThan(4);
    expect(Math.abs(binomialPull(flipped, found, 0.01))).toBeLessThan(4);
  });
  it('sum the hadrons of a tau decay written in several pieces into one visible system', () => {
    const record = new EventRecord();
    addBeams(record);
    const tau = addParticle(record, -15, STATUS_DECAYED, 0, 80, -1.0, 2.0, M_TAU);
    const rho = addParticle(record, 213, STATUS_DECAYED, tau, 60, -1.0, 2.0, 0.775);
    addParticle(record, 211, STATUS_FINAL, rho, 35, -1.02, 2.01, 0.1396);
    addParticle(record, 111, STATUS_FINAL, rho, 25, -0.97, 1.99, 0.135);
    addParticle(record, -16, STATUS_FINAL, tau, 20, -1.0, 2.0);
    const always = perfectProfile();
    const detector = createDetector({ ...always, taus: { ...always.taus, efficiency: constantTable(1), chargeFlip: new EtaBinnedValues([0, 10], [0]) } });
    const out = new RecoEvent();
    detector.reconstruct(record, RandomStream.forStream(2), out);
    expect(out.taus.size).toBe(1);
    expect(out.taus.charge[0]).toBe(1); // a tau+ (PDG id -15)
    for (let c = 0; c < 4; c++) expectClose(out.taus.momentum[c]!, record.momentum[4 * 4 + c]! + record.momentum[4 * 5 + c]!, { rel: 1e-12 });
    expect(out.jets.size).toBe(0);
  });
  it('are built from every visible system the generator writes (pi, rho, a1 and the lumped id 98)', () => {
    const p = perfectProfile();
    const detector = createDetector({ ...p, taus: { ...p.taus, efficiency: constantTable(1), chargeFlip: new EtaBinnedValues([0, 10], [0]) } });
    const out = new RecoEvent();
    for (const visible of [211, 213, 20213, 98]) {
      const record = new EventRecord();
      addBeams(record);
      addHadronicTau(record, -15, 40, 1.0, -0.5, visible);
      detector.reconstruct(record, RandomStream.forStream(3), out);
      expect(out.taus.size).toBe(1);
      expect(out.taus.charge[0]).toBe(1);
      expect(out.taus.truthId[0]).toBe(-15);
      expectClose(out.taus.pt[0]!, 40, { rel: 1e-12 });
    }
  });
  it('are found through an intermediate W* written between the tau and its hadrons', () => {
    const record = new EventRecord();
    addBeams(record);
    const tau = addParticle(record, 15, STATUS_DECAYED, 0, 50, 0.2, 0.4, M_TAU);
    addParticle(record, 16, STATUS_FINAL, tau, 10, 0.2, 0.4);
    const w = addParticle(record, -24, STATUS_DECAYED, tau, 40, 0.2, 0.4, 1.2);
    addParticle(record, -211, STATUS_FINAL, w, 40, 0.2, 0.4, 0.14);
    const p = perfectProfile();
    const detector = createDetector({ ...p, taus: { ...p.taus, efficiency: constantTable(1) } });
    const out = new RecoEvent();
    detector.reconstruct(record, RandomStream.forStream(5), out);
    expect(out.taus.size).toBe(1);
    expect(out.taus.truthId[0]).toBe(15);
  });
  it('decaying leptonically give a light lepton and no tau', () => {
    const record = new EventRecord();
    addBeams(record);
    const tau = addParticle(record, 15, STATUS_DECAYED, 0, 60, 0.2, 0.0, M_TAU);
    addParticle(record, 13, STATUS_FINAL, tau, 40, 0.2, 0.0);
    addParticle(record, -14, STATUS_FINAL, tau, 10, 0.2, 0.0);
    addParticle(record, 16, STATUS_FINAL, tau, 10, 0.2, 0.0);
    const detector = createDetector(perfectProfile());
    const out = new RecoEvent();
    let muons = 0;
    for (let k = 0; k < 200; k++) {
      detector.reconstruct(record, RandomStream.forStream(107, k), out);
      expect(out.taus.size).toBe(0);
      muons += out.muons.size;
      if (out.muons.size === 1) expect(out.muons.truthId[0]).toBe(13);
    }
    expect(muons).toBeGreaterThan(180); // 98% efficiency
  });
});

describe('jets, photons and unidentified electrons', () => {
  const out = new RecoEvent();
  it('merge two partons closer than the jet radius into one jet', () => {
    const record = new EventRecord();
    addBeams(record);
    addParticle(record, 1, STATUS_FINAL, 0, 60, 0.3, 1.0);
    addParticle(record, -2, STATUS_FINAL, 0, 40, 0.3, 1.2);
    addParticle(record, 4, STATUS_FINAL, 0, 40, -1.5, -2.0);
    const p = perfectProfile();
    const detector = createDetector({ ...p, taus: { ...p.taus, jetFakeRate: constantTable(0) } });
    detector.reconstruct(record, RandomStream.forStream(3), out);
    expect(out.jets.size).toBe(2);
    expectClose(out.jets.momentum[3]!, record.momentum[4 * 2 + 3]! + record.momentum[4 * 3 + 3]!, { rel: 1e-12 });
    expect(out.jets.truthId[1]).toBe(4);
    expect(out.jets.pt[0]).toBeGreaterThan(out.jets.pt[1]!);
  });
  it('turn an unidentified electron and a photon into jets', () => {
    const record = new EventRecord();
    addBeams(record);
    addParticle(record, -11, STATUS_FINAL, 0, 50, 0.3, 1.0);
    addParticle(record, 22, STATUS_FINAL, 0, 70, 1.3, -2.0);
    const p = perfectProfile();
    const detector = createDetector({ ...p, electrons: { ...p.electrons, efficiency: constantTable(0) }, taus: { ...p.taus, jetFakeRate: constantTable(0) } });
    detector.reconstruct(record, RandomStream.forStream(4), out);
    expect(out.electrons.size).toBe(0);
    expect([...out.jets.truthId.subarray(0, out.jets.size)]).toEqual([22, -11]);
    expectClose(out.jets.pt[0]!, 70, { rel: 1e-12 });
    expectClose(out.jets.pt[1]!, 50, { rel: 1e-12 });
  });
  it('let a jet fake a tau with the fake rate, with either charge', () => {
    const record = new EventRecord();
    addBeams(record);
    addParticle(record, 21, STATUS_FINAL, 0, 50, 0.3, 1.0);
    const p = perfectProfile();
    const detector = createDetector({ ...p, taus: { ...p.taus, jetFakeRate: constantTable(1) } });
    let positive = 0;
    for (let k = 0; k < 400; k++) {
      detector.reconstruct(record, RandomStream.forStream(108, k), out);
      expect(out.jets.size).toBe(0);
      expect(out.taus.size).toBe(1);
      expect(out.taus.truthId[0]).toBe(21);
      positive += out.taus.charge[0] === 1 ? 1 : 0;
    }
    expect(Math.abs(binomialPull(positive, 400, 0.5))).toBeLessThan(4);
  });
});

describe('the detector as a whole', () => {
  function busyRecord(): EventRecord {
    const record = new EventRecord(8);
    zToLeptons(record, 11);
    addHadronicTau(record, -15, 45, -1.9, 2.9, 213);
    addParticle(record, 5, STATUS_FINAL, 0, 120, 1.1, 2.0, 4.7);
    addParticle(record, 2, STATUS_FINAL, 0, 30, -2.4, -2.2);
    addParticle(record, 13, STATUS_FINAL, 0, 35, 2.3, -0.4);
    addParticle(record, -14, STATUS_FINAL, 0, 20, 0.1, 2.4);
    record.weight = 0.25;
    return record;
  }
  const snapshot = (e: RecoEvent): unknown => ({
    lists: [e.electrons, e.muons, e.taus, e.jets].map((l) => ({ p: [...l.momentum.subarray(0, 4 * l.size)], q: [...l.charge.subarray(0, l.size)], t: [...l.tag.subarray(0, l.size)], id: [...l.truthId.subarray(0, l.size)] })),
    met: [e.metX, e.metY],
    w: e.weight,
  });
  it('gives the same reconstructed event for the same random stream, and another for another stream', () => {
    const record = busyRecord();
    const a = new RecoEvent();
    const b = new RecoEvent();
    createDetector(PROFILE_8TEV).reconstruct(record, RandomStream.forStream(9, 1), a);
    const reused = createDetector(PROFILE_8TEV);
    reused.reconstruct(record, RandomStream.forStream(9, 2), b);
    expect(snapshot(b)).not.toEqual(snapshot(a));
    reused.reconstruct(record, RandomStream.forStream(9, 1), b);
    expect(snapshot(b)).toEqual(snapshot(a));
    expect(b.weight).toBe(0.25);
  });
  it('sorts every object list by decreasing pT', () => {
    const record = busyRecord();
    const out = new RecoEvent();
    const detector = createDetector(PROFILE_MANY_FAKE_TAUS);
    for (let k = 0; k < 300; k++) {
      detector.reconstruct(record, RandomStream.forStream(110, k), out);
      for (const list of [out.electrons, out.muons, out.taus, out.jets]) {
        for (let i = 1; i < list.size; i++) expect(list.pt[i]).toBeLessThanOrEqual(list.pt[i - 1]!);
      }
    }
  });
  it('refuses a final state with a particle the generator should have decayed, or an unknown one', () => {
    const record = new EventRecord();
    addBeams(record);
    addParticle(record, -6, STATUS_FINAL, 0, 100, 0, 0, 172.57);
    const detector = createDetector(PROFILE_8TEV);
    expect(() => detector.reconstruct(record, RandomStream.forStream(1), new RecoEvent())).toThrow(TamisError);
    expect(() => detector.reconstruct(record, RandomStream.forStream(1), new RecoEvent())).toThrow(/particle 2 \(PDG id -6\) should have decayed/);
    record.pdgId[2] = 9_000_001;
    expect(() => detector.reconstruct(record, RandomStream.forStream(1), new RecoEvent())).toThrow(/PDG id 9000001, which the detector does not know how to see/);
  });
});

/** The 8 TeV-era profile with many fake taus, so that the tau list is often long. */
const PROFILE_MANY_FAKE_TAUS = { ...PROFILE_8TEV, taus: { ...PROFILE_8TEV.taus, jetFakeRate: constantTable(0.5) } };
