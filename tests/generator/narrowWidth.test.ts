/**
 * A narrow resonance: the full Breit–Wigner integral of the partonic cross
 * section against the narrow-width formula
 *
 *   integral ds sigma(q qbar' -> R -> f) = (2J+1)/((2s1+1)(2s2+1)) (1/N_c^2) 16 pi^2 Gamma_in Gamma_out / (M Gamma)
 *                                        = (4 pi^2 / 3) (Gamma(R -> q qbar') / M) Gamma(R -> f) / Gamma
 *
 * (resonance formula of the PDG Review, "Cross-section formulae for specific
 * processes", sigma = (2J+1)/((2S1+1)(2S2+1)) (4 pi/k^2) B_in B_out Gamma^2/4 / ((E - M)^2 + Gamma^2/4),
 * with a colour-singlet resonance formed by 1 of the N_c^2 colour states and the
 * Breit–Wigner integrated over s: integral ds M^2 Gamma^2 / ((s - M^2)^2 + M^2 Gamma^2) = pi M Gamma).
 * The matrix elements and the partial widths are derived independently
 * (traces with helicity projectors versus polarisation sums), so agreement
 * checks both, with unequal masses and chiral couplings.
 */
import { describe, it } from 'vitest';
import { vectorToFermionsWidth, vectorToScalarsWidth } from '../../src/generator/resonanceWidths.js';
import { PairMatrixElement } from '../../src/generator/processes/index.js';
import type { MediatorCouplings } from '../../src/generator/model/types.js';
import { expectClose } from '../helpers.js';

/** Composite 8-point Gauss–Legendre nodes and weights on [-1, 1] (Abramowitz and Stegun table 25.4). */
const GL8_X = [-0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498, 0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
const GL8_W = [0.1012285362903763, 0.2223810344533745, 0.3137066553851941, 0.362683783378362, 0.362683783378362, 0.3137066553851941, 0.2223810344533745, 0.1012285362903763];

/** integral of f(s) ds over [a, b] with s = M^2 + M Gamma tan(rho), which flattens the peak. */
function integrateBreitWigner(f: (s: number) => number, a: number, b: number, mass: number, width: number): number {
  const mg = mass * width;
  const r0 = Math.atan((a - mass * mass) / mg);
  const r1 = Math.atan((b - mass * mass) / mg);
  const panels = 400;
  const h = (r1 - r0) / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = r0 + (p + 0.5) * h;
    for (let k = 0; k < 8; k++) {
      const rho = mid + (h / 2) * GL8_X[k]!;
      const t = Math.tan(rho);
      const s = mass * mass + mg * t;
      sum += (h / 2) * GL8_W[k]! * f(s) * mg * (1 + t * t);
    }
  }
  return sum;
}

describe('narrow resonance: Breit–Wigner integral versus the narrow-width formula (Gamma/M = 1e-3)', () => {
  const M = 1000;
  const Gamma = 1;
  const quark = { left: 0.03, right: 0.012 };
  const gammaIn = vectorToFermionsWidth(M, quark.left, quark.right, 0, 0, 3);
  const cases = [
    { label: 'neutral scalar pair', spin: 0 as const, kind: 'neutral' as const, m1: 300, m2: 300, pair: { left: 0.6, right: 0.6 } },
    { label: 'charged scalar pair, unequal masses', spin: 0 as const, kind: 'charged' as const, m1: 350, m2: 200, pair: { left: 0.6, right: 0.6 } },
    { label: 'neutral heavy-fermion pair, chiral couplings', spin: 0.5 as const, kind: 'neutral' as const, m1: 250, m2: 250, pair: { left: 0.3, right: -0.1 } },
    { label: 'charged fermion pair, unequal masses, chiral couplings', spin: 0.5 as const, kind: 'charged' as const, m1: 420, m2: 150, pair: { left: 0.35, right: 0.15 } },
  ];
  for (const c of cases) {
    it(`${c.label}: within 1%`, () => {
      const resonance: MediatorCouplings = { name: 'R', mass: M, width: Gamma, up: quark, down: c.kind === 'neutral' ? quark : { left: 0, right: 0 }, pair: c.pair };
      const me = new PairMatrixElement([resonance], c.spin, c.kind, c.m1, c.m2);
      const gammaOut = c.spin === 0 ? vectorToScalarsWidth(M, c.pair.left, c.m1, c.m2) : vectorToFermionsWidth(M, c.pair.left, c.pair.right, c.m1, c.m2, 1);
      const narrow = ((4 * Math.PI ** 2) / 3) * (gammaIn / M) * (gammaOut / Gamma);
      const full = integrateBreitWigner((s) => me.partonicCrossSection(s, 0), 0.5 * M * M, 1.5 * M * M, M, Gamma);
      expectClose(full, narrow, { rel: 0.01 });
    });
  }
});
