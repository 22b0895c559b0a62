/**
 * Partonic cross sections of the pair processes against published closed forms.
 */
import { describe, expect, it } from 'vitest';
import { ALPHA_EM_0, CKM, GAMMA_W, GAMMA_Z, GEV2_TO_PB, G_FERMI, M_W, M_Z, SIN2_THETA_W } from '../../src/physics/constants.js';
import { kallen } from '../../src/physics/phaseSpace.js';
import { couplingsFrom, electroweakCouplings, fermionZCouplings } from '../../src/generator/electroweak.js';
import { PairMatrixElement } from '../../src/generator/processes/index.js';
import type { MediatorCouplings } from '../../src/generator/model/types.js';
import { expectClose } from '../helpers.js';

const both = (g: number) => ({ left: g, right: g });
const ew0 = couplingsFrom('alpha_mz', ALPHA_EM_0, SIN2_THETA_W);

/** Photon exchange between a charge -1 initial lepton and a pair of charge qPair. */
function photon(e: number, qInitial: number, qPair: number): MediatorCouplings {
  return { name: 'photon', mass: 0, width: 0, up: both(qInitial * e), down: both(qInitial * e), pair: both(qPair * e) };
}

/** Integral of a0 + a1 c + a2 c^2 over [lo, hi]. */
function integrate(me: PairMatrixElement, s: number, lo: number, hi: number): number {
  const out = new Float64Array(6);
  me.coefficients(s, out);
  const f = (c: number) => out[0]! * c + (out[1]! * c * c) / 2 + (out[2]! * c * c * c) / 3;
  return f(hi) - f(lo);
}

describe('point cross section through a photon', () => {
  // PDG Review of Particle Physics, "Cross-section formulae for specific processes":
  // sigma(e+e- -> mu+mu-) = 4 pi alpha^2 / (3 s) = 86.8 nb / s[GeV^2] (checks.md section 4).
  const s = 100;
  const pointPb = ((4 * Math.PI * ALPHA_EM_0 ** 2) / (3 * s)) * GEV2_TO_PB;

  it('e+e- -> mu+mu- is 4 pi alpha^2/(3s) = 86.8 nb/s[GeV^2]', () => {
    const me = new PairMatrixElement([photon(ew0.e, -1, -1)], 0.5, 'neutral', 0, 0, 1);
    expectClose(me.partonicCrossSection(s, 0) * GEV2_TO_PB, pointPb, { rel: 1e-12 });
    expectClose(me.partonicCrossSection(s, 0) * GEV2_TO_PB * s, 86.8e3, { rel: 1e-3 }, 'nb -> pb');
  });

  it('a colourless complex scalar pair is beta^3/4 of it with the sin^2 theta shape', () => {
    for (const m of [0.5, 2, 4.5]) {
      const beta = Math.sqrt(1 - (4 * m * m) / s);
      const me = new PairMatrixElement([photon(ew0.e, -1, 1)], 0, 'neutral', m, m, 1);
      expectClose(me.partonicCrossSection(s, 0) * GEV2_TO_PB, (pointPb * beta ** 3) / 4, { rel: 1e-12 });
      // dsigma/dc = sigma * 3/4 (1 - c^2)
      for (const c of [-0.9, -0.3, 0, 0.6]) expectClose(me.dsigmaDcos(s, 0, c) * GEV2_TO_PB, ((pointPb * beta ** 3) / 4) * 0.75 * (1 - c * c), { rel: 1e-12 });
    }
  });

  it('a heavy Dirac fermion pair is beta (3 - beta^2)/2 of it with the shape 1 + c^2 + (1 - beta^2) sin^2', () => {
    for (const m of [0.5, 2, 4.5]) {
      const beta = Math.sqrt(1 - (4 * m * m) / s);
      const me = new PairMatrixElement([photon(ew0.e, -1, -1)], 0.5, 'neutral', m, m, 1);
      const total = (pointPb * beta * (3 - beta * beta)) / 2;
      expectClose(me.partonicCrossSection(s, 0) * GEV2_TO_PB, total, { rel: 1e-12 });
      // normalised shape: (1 + c^2 + (1 - b^2)(1 - c^2)) / integral, integral = 4 (3 - b^2)/3
      for (const c of [-0.8, 0, 0.5, 0.99]) {
        const shape = (1 + c * c + (1 - beta * beta) * (1 - c * c)) / ((4 * (3 - beta * beta)) / 3);
        expectClose(me.dsigmaDcos(s, 0, c) * GEV2_TO_PB, total * shape, { rel: 1e-12 });
      }
    }
  });
});

describe('quark-initiated checks of checks.md section 4', () => {
  it('u ubar -> S S* through the photon is pi alpha^2 Q_q^2 Q_S^2 beta^3 / (9 s)', () => {
    const ew = electroweakCouplings();
    const m = 300;
    const s = 800 ** 2;
    const beta = Math.sqrt(1 - (4 * m * m) / s);
    const me = new PairMatrixElement([{ name: 'photon', mass: 0, width: 0, up: both((2 / 3) * ew.e), down: both((-1 / 3) * ew.e), pair: both(-ew.e) }], 0, 'neutral', m, m);
    expectClose(me.partonicCrossSection(s, 0), (Math.PI * ew.alpha ** 2 * (4 / 9) * beta ** 3) / (9 * s), { rel: 1e-12 });
    expectClose(me.partonicCrossSection(s, 1), (Math.PI * ew.alpha ** 2 * (1 / 9) * beta ** 3) / (9 * s), { rel: 1e-12 });
  });

  it('u dbar -> W* -> S+ S0 is G_F^2 M_W^4 |V|^2 lambda^(3/2) s |P_W|^2 / (36 pi) in the G_F scheme', () => {
    const ew = electroweakCouplings('fermi_constant');
    const g = ew.gW / Math.SQRT2;
    const w: MediatorCouplings = { name: 'W', mass: M_W, width: GAMMA_W, up: { left: g, right: 0 }, down: both(0), pair: both(g) };
    for (const [m1, m2, sqrtS] of [
      [200, 150, 500],
      [300, 300, 2000],
      [80, 10, 95],
    ] as const) {
      const s = sqrtS * sqrtS;
      const me = new PairMatrixElement([w], 0, 'charged', m1, m2);
      const lambda = kallen(1, (m1 * m1) / s, (m2 * m2) / s);
      const p2 = 1 / ((s - M_W * M_W) ** 2 + ((s * GAMMA_W) / M_W) ** 2);
      const vud2 = CKM[0]![0]! ** 2;
      const expected = (G_FERMI ** 2 * M_W ** 4 * vud2 * lambda ** 1.5 * s * p2) / (36 * Math.PI);
      expectClose(me.partonicCrossSection(s, 0) * vud2, expected, { rel: 1e-12 }, `${m1}, ${m2}, ${sqrtS}`);
    }
  });
});

describe('photon-Z interference and chirality', () => {
  const ew = ew0;
  const [eL, eR] = fermionZCouplings(-0.5, 0, -1, ew.sin2W);
  const leptonic = (withPhoton: boolean): MediatorCouplings[] => {
    const z: MediatorCouplings = { name: 'Z', mass: M_Z, width: GAMMA_Z, up: { left: ew.gZ * eL, right: ew.gZ * eR }, down: { left: ew.gZ * eL, right: ew.gZ * eR }, pair: { left: ew.gZ * eL, right: ew.gZ * eR } };
    return withPhoton ? [photon(ew.e, -1, -1), z] : [z];
  };
  const asymmetry = (me: PairMatrixElement, s: number) => (integrate(me, s, 0, 1) - integrate(me, s, -1, 0)) / integrate(me, s, -1, 1);

  it('Z alone at the pole: A_FB = (3/4) A_e A_mu (PDG electroweak review; from memory)', () => {
    const me = new PairMatrixElement(leptonic(false), 0.5, 'neutral', 0, 0, 1);
    const gV = -0.5 + 2 * ew.sin2W;
    const gA = -0.5;
    const A = (2 * gV * gA) / (gV * gV + gA * gA);
    expectClose(asymmetry(me, M_Z * M_Z), 0.75 * A * A, { rel: 1e-10 });
  });

  it('photon + Z: the lowest-order A0 (1 + c^2) + A1 c law with chi = s/(4 s_W^2 c_W^2 (s - M^2 + i s Gamma/M))', () => {
    // Standard lowest-order e+e- -> f fbar result (e.g. R. K. Ellis, W. J. Stirling and B. R. Webber,
    // "QCD and Collider Physics", chapter 3 — from memory), v = T3 - 2 Q s^2, a = T3:
    // A0 = 1 + 2 v_e v_f Re chi + (v_e^2 + a_e^2)(v_f^2 + a_f^2)|chi|^2, A1 = 4 a_e a_f Re chi + 8 v_e a_e v_f a_f |chi|^2.
    const v = -0.5 + 2 * ew.sin2W;
    const a = -0.5;
    const me = new PairMatrixElement(leptonic(true), 0.5, 'neutral', 0, 0, 1);
    for (const sqrtS of [35, 60, 91.188, 120, 200]) {
      const s = sqrtS * sqrtS;
      const k = 1 / (4 * ew.sin2W * (1 - ew.sin2W));
      const dr = s - M_Z * M_Z;
      const di = (s * GAMMA_Z) / M_Z;
      const d = dr * dr + di * di;
      const reChi = (k * s * dr) / d;
      const absChi2 = (k * k * s * s) / d;
      const A0 = 1 + 2 * v * v * reChi + (v * v + a * a) ** 2 * absChi2;
      const A1 = 4 * a * a * reChi + 8 * v * a * v * a * absChi2;
      expectClose(asymmetry(me, s), (3 / 8) * (A1 / A0), { rel: 1e-9 }, `sqrt s = ${sqrtS}`);
      const normalisation = (Math.PI * ew.alpha ** 2) / (2 * s); // dsigma/dc = pi alpha^2/(2s) [A0 (1+c^2) + A1 c]
      expectClose(me.dsigmaDcos(s, 0, 0.3), normalisation * (A0 * 1.09 + A1 * 0.3), { rel: 1e-9 });
    }
    // Below the pole the asymmetry is negative (about -0.09 at 35 GeV, the value seen in e+e- data of that era; from memory).
    expect(asymmetry(me, 35 * 35)).toBeLessThan(-0.08);
  });

  it('a purely axial massive pair rises as beta^3 (P wave)', () => {
    const axial: MediatorCouplings = { name: 'X', mass: 1000, width: 10, up: both(0.3), down: both(0.3), pair: { left: 0.2, right: -0.2 } };
    const me = new PairMatrixElement([axial], 0.5, 'neutral', 100, 100, 1);
    const ratio = (s: number) => me.partonicCrossSection(s, 0) / new PairMatrixElement([axial], 0.5, 'neutral', 0, 0, 1).partonicCrossSection(s, 0);
    for (const sqrtS of [210, 300, 600]) expectClose(ratio(sqrtS * sqrtS), (1 - (4 * 100 * 100) / (sqrtS * sqrtS)) ** 1.5, { rel: 1e-12 });
  });

  it('is zero at and below threshold', () => {
    const me = new PairMatrixElement(leptonic(true), 0.5, 'neutral', 100, 50, 1);
    expect(me.partonicCrossSection(150 * 150, 0)).toBe(0);
    expect(me.partonicCrossSection(100 * 100, 0)).toBe(0);
  });
});
