import { describe, expect, it } from 'vitest';
import { OBJECT_DEFAULTS } from '../../src/selection/objectDefaults.js';
import type { ObjectDefinitions } from '../../src/selection/objects.js';
import { variablesOfEvent } from '../../src/selection/eventVariables.js';
import { VARIABLES } from '../../src/selection/variables.js';
import { expectClose } from '../helpers.js';
import { makeEvent } from './recoEvents.js';

// M_Z = 91.188 GeV: PDG 2024 (Phys. Rev. D 110, 030001), mass/width table.
const M_Z = 91.188;

/**
 * Pair mass of two massless objects, m^2 = 2 pT1 pT2 (cosh(d eta) - cos(d phi))
 * (standard collider kinematics, e.g. PDG review "Kinematics", section on
 * hadron-collider variables).
 */
function masslessPairMass(pt1: number, eta1: number, phi1: number, pt2: number, eta2: number, phi2: number): number {
  return Math.sqrt(2 * pt1 * pt2 * (Math.cosh(eta1 - eta2) - Math.cos(phi1 - phi2)));
}

/** Transverse mass, mT^2 = 2 pT met (1 - cos(d phi)) (common practice). */
function transverseMass(pt: number, phi: number, met: number, metPhi: number): number {
  return Math.sqrt(2 * pt * met * (1 - Math.cos(phi - metPhi)));
}

describe('event variables on a three-lepton event with a Z pair, a b-jet and a light jet', () => {
  // mu+ and mu- back to back at eta 0 with pT = M_Z / 2 form an exact Z-mass pair.
  const zPt = M_Z / 2;
  const event = makeEvent({
    muons: [[zPt, 0, 0, 1], [zPt, 0, Math.PI, -1]],
    electrons: [[30, 1, Math.PI / 2, 1]],
    jets: [[60, -1.5, -Math.PI / 2, 0], [40, 2, 2.5, 1]],
    met: [40, 0],
  });
  const v = variablesOfEvent(event);
  const mMuE = masslessPairMass(zPt, 0, 0, 30, 1, Math.PI / 2); // both muons see the electron at d phi = pi/2, d eta = 1

  it('counts objects', () => {
    expect([v.n_leptons, v.n_electrons, v.n_muons, v.n_taus, v.n_leptons_plus_taus, v.n_jets, v.n_bjets]).toEqual([3, 1, 2, 0, 3, 2, 1]);
  });
  it('counts one SFOS pair and one same-sign pair (mu+ e+); total charge +1', () => {
    expect([v.n_sfos, v.n_ss_pairs, v.total_charge]).toEqual([1, 1, 1]);
  });
  it('finds the Z pair mass, the smallest pair masses and the three-lepton mass', () => {
    expectClose(v.mll_z!, M_Z, { rel: 1e-12 });
    expectClose(v.min_mll_sfos!, M_Z, { rel: 1e-12 });
    expectClose(v.min_mll!, mMuE, { rel: 1e-12 });
    // For massless momenta m^2(1+2+3) = m12^2 + m13^2 + m23^2.
    expectClose(v.mlll!, Math.sqrt(M_Z * M_Z + 2 * mMuE * mMuE), { rel: 1e-12 });
  });
  it('sums momenta: met, ht, lt, meff', () => {
    expectClose(v.met!, 40, { rel: 1e-12 });
    expectClose(v.ht!, 100, { rel: 1e-12 });
    expectClose(v.lt!, M_Z + 30, { rel: 1e-12 });
    expectClose(v.meff!, 100 + M_Z + 30 + 40, { rel: 1e-12 });
  });
  it('takes the transverse mass with the lepton outside the Z pair (the electron)', () => {
    expectClose(v.mt!, transverseMass(30, Math.PI / 2, 40, 0), { rel: 1e-12 });
    expectClose(v.mt!, Math.sqrt(2400), { rel: 1e-12 });
  });
  it('orders leptons by pT and reports absent objects as 0', () => {
    expectClose(v.lep1_pt!, zPt, { rel: 1e-12 });
    expectClose(v.lep2_pt!, zPt, { rel: 1e-12 });
    expectClose(v.lep3_pt!, 30, { rel: 1e-12 });
    expect(v.tau1_pt).toBe(0);
    expectClose(v.jet1_pt!, 60, { rel: 1e-12 });
  });
  it('gives a value for every variable in the table', () => {
    for (const variable of VARIABLES) expect(Number.isFinite(v[variable.name]), variable.name).toBe(true);
  });
});

describe('event variables on a same-sign dilepton event', () => {
  const v = variablesOfEvent(
    makeEvent({
      electrons: [[50, 0.5, 0, 1]],
      muons: [[25, -0.5, 2, 1]],
      jets: [[80, 1.5, -2, 0], [45, -2, 1, 0], [35, 0.1, -0.9, 1]],
      met: [80, 3],
    }),
  );
  it('counts one same-sign pair, no SFOS pair, total charge +2', () => {
    expect([v.n_ss_pairs, v.n_sfos, v.total_charge, v.n_jets, v.n_bjets]).toEqual([1, 0, 2, 3, 1]);
  });
  it('reports 0 for the Z-pair masses without an SFOS pair, and uses the leading lepton for mt', () => {
    expect([v.mll_z, v.min_mll_sfos, v.mlll]).toEqual([0, 0, 0]);
    expectClose(v.min_mll!, masslessPairMass(50, 0.5, 0, 25, -0.5, 2), { rel: 1e-12 });
    expectClose(v.mt!, transverseMass(50, 0, 80, 3), { rel: 1e-12 });
    expectClose(v.ht!, 160, { rel: 1e-12 });
  });
});

describe('event variables with a hadronic tau', () => {
  // A muon, a tau candidate 0.1 from the muon (removed: taus near leptons),
  // a kept tau, and a jet 0.1 from the kept tau (removed: jets near taus).
  const v = variablesOfEvent(
    makeEvent({
      muons: [[35, 0.2, 1, -1]],
      taus: [[40, -1, -2, 1], [22, 0.3, 1, 1]],
      jets: [[45, -1.1, -2, 0], [50, 1.8, 2.5, 0]],
      met: [25, 1],
    }),
  );
  it('keeps one tau and one jet after overlap removal', () => {
    expect([v.n_taus, v.n_leptons, v.n_leptons_plus_taus, v.n_jets]).toEqual([1, 1, 2, 1]);
    expectClose(v.tau1_pt!, 40, { rel: 1e-12 });
  });
  it('counts taus in lt but not in lepton pairs', () => {
    expectClose(v.lt!, 75, { rel: 1e-12 });
    expect([v.n_sfos, v.n_ss_pairs, v.total_charge, v.min_mll]).toEqual([0, 0, -1, 0]);
  });
});

describe('an event with no invisible particle and missing momentum from smearing', () => {
  // Two jets balanced at 100 GeV each; the detector measured the first at 92 GeV.
  // Missing momentum = minus the vector sum of what was seen = 8 GeV along the first jet.
  const seen: [number, number][] = [[92, 0], [100, Math.PI]];
  const metX = -seen.reduce((s, [pt, phi]) => s + pt * Math.cos(phi), 0);
  const metY = -seen.reduce((s, [pt, phi]) => s + pt * Math.sin(phi), 0);
  const v = variablesOfEvent(
    makeEvent({ jets: [[92, 0.3, 0, 0], [100, -0.4, Math.PI, 0]], electrons: [[20, 0, Math.PI / 2, -1]], met: [Math.hypot(metX, metY), Math.atan2(metY, metX)] }),
  );
  it('reports the measured missing momentum and the transverse mass it makes', () => {
    expectClose(v.met!, 8, { rel: 1e-9 });
    expectClose(v.mt!, transverseMass(20, Math.PI / 2, 8, 0), { rel: 1e-9 });
    expectClose(v.ht!, 192, { rel: 1e-12 });
  });
});

describe('object definitions: thresholds, isolation, overlap removal, b-jets', () => {
  it('counts n_sfos as disjoint pairs: e+ e- e+ gives 1, e+ e- mu+ mu- gives 2', () => {
    const three = variablesOfEvent(makeEvent({ electrons: [[40, 0, 0, 1], [30, 1, 2, -1], [20, -1, -2, 1]] }));
    expect([three.n_sfos, three.n_ss_pairs]).toEqual([1, 1]);
    const four = variablesOfEvent(makeEvent({ electrons: [[40, 0, 0, 1], [30, 1, 2, -1]], muons: [[25, -1, -2, 1], [15, 2, -0.5, -1]] }));
    expect([four.n_sfos, four.n_ss_pairs, four.total_charge]).toEqual([2, 2, 0]);
  });

  it('drops leptons below the pT threshold or outside |eta|', () => {
    const v = variablesOfEvent(makeEvent({ electrons: [[9.9, 0, 0, 1], [20, 2.6, 1, 1], [20, 2.4, 2, 1]] }));
    expect(v.n_electrons).toBe(1);
  });

  it('applies relative isolation with every candidate in the cone (also jets below threshold)', () => {
    const definitions: ObjectDefinitions = { ...OBJECT_DEFAULTS, electrons: { ...OBJECT_DEFAULTS.electrons, maxRelativeIsolation: 0.15 }, overlapRemoval: { tausNearLeptons: 0, jetsNearLeptons: 0, jetsNearTaus: 0, leptonsNearJets: 0 } };
    // 10 GeV jet 0.2 from a 20 GeV electron: I = 0.5 > 0.15, not isolated; 2.5 GeV muon nearby the other electron: I = 0.125, isolated.
    const event = makeEvent({ electrons: [[20, 0, 0, 1], [20, 1, 2, -1]], muons: [[2.5, 1.1, 2.1, 1]], jets: [[10, 0.2, 0, 0]] });
    expect(variablesOfEvent(event, definitions).n_electrons).toBe(1);
    expect(variablesOfEvent(event).n_electrons).toBe(2); // the default has no isolation requirement
  });

  it('removes jets near leptons first, then leptons near the remaining jets', () => {
    // Jet A 0.1 from the electron is removed; jet B 0.3 from the muon stays and removes the muon.
    const v = variablesOfEvent(makeEvent({ electrons: [[30, 0, 0, 1]], muons: [[30, 1, 2, -1]], jets: [[50, 0.1, 0, 0], [60, 1.3, 2, 0]] }));
    expect([v.n_electrons, v.n_muons, v.n_jets]).toEqual([1, 0, 1]);
    expectClose(v.ht!, 60, { rel: 1e-12 });
  });

  it('counts a b-tagged jet as a b-jet only inside the b-jet thresholds', () => {
    const definitions: ObjectDefinitions = { ...OBJECT_DEFAULTS, bJets: { minPt: 30, maxAbsEta: 2.0 } };
    const v = variablesOfEvent(makeEvent({ jets: [[50, 2.4, 0, 1], [50, 1.0, 2, 1]] }), definitions);
    expect([v.n_jets, v.n_bjets]).toEqual([2, 1]);
  });
});

describe('missing momentum of a detector-reconstructed event with no invisible particle', () => {
  it('is the smeared imbalance the detector reports: non-zero, and small next to the visible momenta (200 seeded reconstructions)', async () => {
    const { createDetector } = await import('../../src/detector/detector.js');
    const { findDetectorProfile } = await import('../../src/detector/profile/builtInProfiles.js');
    const { RecoEvent } = await import('../../src/detector/recoEvent.js');
    const { EventRecord, STATUS_FINAL, STATUS_INCOMING } = await import('../../src/generator/eventRecord.js');
    const { setPtEtaPhiM } = await import('../../src/physics/fourVector.js');
    const { RandomStream } = await import('../../src/physics/random.js');
    const record = new EventRecord();
    record.add(2, STATUS_INCOMING, -1, -1, 0, 0, 400, 400, 0);
    record.add(-2, STATUS_INCOMING, -1, -1, 0, 0, -400, 400, 0);
    // mu+ mu- and two light quarks, balanced in the transverse plane: no invisible particle at all.
    const p = new Float64Array(4);
    for (const [id, pt, eta, phi] of [[13, 60, 0.4, 0], [-13, 60, -0.3, Math.PI], [1, 120, 1.0, Math.PI / 2], [-1, 120, -1.2, -Math.PI / 2]] as const) {
      setPtEtaPhiM(p, 0, pt, eta, phi, 0);
      record.add(id, STATUS_FINAL, 0, 1, p[0]!, p[1]!, p[2]!, p[3]!, 0);
    }
    const detector = createDetector(findDetectorProfile('generic-13tev'));
    const reco = new RecoEvent();
    const values: number[] = [];
    for (let k = 0; k < 200; k++) {
      detector.reconstruct(record, RandomStream.forStream(8, k), reco);
      const v = variablesOfEvent(reco);
      expectClose(v.met!, Math.hypot(reco.metX, reco.metY), { rel: 1e-12 });
      values.push(v.met!);
    }
    values.sort((a, b) => a - b);
    // Resolution-driven imbalance (common practice: jet resolution ~10% at 120 GeV, a soft term of a few GeV).
    expect(values[0]!).toBeGreaterThan(0);
    expect(values[100]!).toBeGreaterThan(2);
    expect(values[100]!).toBeLessThan(40);
  });
});
