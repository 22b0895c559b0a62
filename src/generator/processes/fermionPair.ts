/**
 * q qbar(') -> V* -> F1 F2bar: a fermion pair (masses m1, m2) through s-channel vectors.
 *
 * For a massless quark of helicity lambda the vectors sum to effective chiral
 * couplings of the final current ubar(k1) gamma^mu (L_lambda P_L + R_lambda P_R) v(k2):
 * L_lambda = sum_V c_q,lambda^V c_F,L^V P_V(s), R_lambda likewise. The traces
 * (final tensor Tr[(k1/ + m1) gamma^mu (L P_L + R P_R)(k2/ - m2) gamma^nu (L* P_L + R* P_R)])
 * give, for a left-handed quark,
 *   sum |M_L|^2 = 16 [ |L_L|^2 (p1.k2)(p2.k1) + |R_L|^2 (p1.k1)(p2.k2) + m1 m2 (p1.p2) Re(L_L R_L*) ]
 * and L <-> R for a right-handed quark (the helicity-conserving combination LL peaks forward,
 * (1 + cos theta)^2 for massless pairs: e.g. Peskin and Schroeder section 5.2 — from memory).
 * In the pair rest frame, with p = lambda^(1/2)(s, m1^2, m2^2) / (2 sqrt s), E_i the energies and
 * theta the angle between the quark and F1, (p1.k1)(p2.k2) = s/4 (E1 - p c)(E2 - p c) and
 * (p1.k2)(p2.k1) = s/4 (E1 + p c)(E2 + p c). Averaging over spins (1/4) and colours (1/N_c) with
 * dsigma/dcos theta = |M|^2 betabar / (32 pi s), betabar = 2 p / sqrt s:
 *
 *   dsigma/dcos theta = betabar / (32 pi N_c) [ (A + B)(E1 E2 + p^2 c^2) + (A - B) p sqrt(s) c + 2 m1 m2 C ],
 *   A = |L_L|^2 + |R_R|^2,  B = |R_L|^2 + |L_R|^2,  C = Re(L_L R_L*) + Re(L_R R_R*).
 *
 * Checks: photon only, m1 = m2 gives the shape 1 + cos^2 theta + (1 - beta^2) sin^2 theta and the
 * total beta (3 - beta^2)/2 x 4 pi alpha^2 Q^2 / (3 s N_c) (tests/generator/processes.test.ts); the pure axial
 * current gives beta^3; the Z-pole forward-backward asymmetry is (3/4) A_e A_f (PDG electroweak review).
 */

/**
 * Writes dsigma/dcos theta = a0 + a1 c + a2 c^2 (GeV^-2) of a fermion pair at `out[offset..offset+2]`.
 * A, B in GeV^-4 and C in GeV^-4 as defined above; masses and energies in GeV.
 *
 * @example
 * const out = new Float64Array(3);
 * fermionPairCoefficients(4, 1, 0, 0, 2, 2, 0, 1, out, 0); // out = [0.039789, 0, 0.039789]: (1 + c^2)/(8 pi)
 */
export function fermionPairCoefficients(
  s: number,
  betaBar: number,
  m1: number,
  m2: number,
  A: number,
  B: number,
  C: number,
  colours: number,
  out: Float64Array,
  offset: number,
): void {
  const sqrtS = Math.sqrt(s);
  const e1 = (s + m1 * m1 - m2 * m2) / (2 * sqrtS);
  const e2 = (s + m2 * m2 - m1 * m1) / (2 * sqrtS);
  const p = 0.5 * betaBar * sqrtS;
  const k = betaBar / (32 * Math.PI * colours);
  out[offset] = k * ((A + B) * e1 * e2 + 2 * m1 * m2 * C);
  out[offset + 1] = k * (A - B) * p * sqrtS;
  out[offset + 2] = k * (A + B) * p * p;
}
