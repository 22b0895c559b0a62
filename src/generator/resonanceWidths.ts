/**
 * Tree-level partial widths of a heavy vector boson V (mass M) into two-body
 * final states, without QCD corrections.
 *
 * Two-body width: Gamma = p* / (8 pi M^2) * (1/3) sum |M|^2 (PDG Review of
 * Particle Physics, "Kinematics", two-body decays), with the polarisation sum
 * sum eps_mu eps*_nu = -g_mu_nu + q_mu q_nu / M^2 (any field-theory textbook,
 * e.g. Peskin and Schroeder section 21.1 — section from memory).
 *
 * Fermion pair, vertex -i gamma^mu (g_L P_L + g_R P_R), masses m1, m2,
 * colour factor N_c (3 for quarks, 1 for colourless fermions):
 *   sum |M|^2 = 2 M^2 (g_L^2 + g_R^2) B + 12 g_L g_R m1 m2,
 *   B = 1 - (m1^2 + m2^2) / (2 M^2) - (m1^2 - m2^2)^2 / (2 M^4),
 *   Gamma = N_c M lambda^(1/2) / (24 pi) [ (g_L^2 + g_R^2) B + 6 g_L g_R m1 m2 / M^2 ],
 * lambda = lambda(1, m1^2/M^2, m2^2/M^2). For m1 = m2 = m and (g_V, g_A) = (g_L + g_R, g_L - g_R)/2 this is
 * the familiar N_c M beta / (12 pi) [ g_V^2 (3 - beta^2) / 2 + g_A^2 beta^2 ], and for massless
 * neutrinos with g_L = g_Z / 2 it gives G_F M_Z^3 / (12 sqrt 2 pi) (PDG electroweak review).
 *
 * Scalar pair, vertex -i g (k1 - k2)^mu:
 *   sum |M|^2 = g^2 M^2 lambda,   Gamma = g^2 M lambda^(3/2) / (48 pi)
 * (the beta^3 law of a P-wave decay, e.g. rho -> pi pi).
 */
import { kallen } from '../physics/phaseSpace.js';

/**
 * Width (GeV) of V -> f1 fbar2 through -i gamma^mu (g_L P_L + g_R P_R); zero below threshold.
 *
 * @example
 * vectorToFermionsWidth(1000, 0.5, 0, 0, 0, 1) // 1000 * 0.25 / (24 pi) = 3.3157 GeV
 */
export function vectorToFermionsWidth(mass: number, gLeft: number, gRight: number, m1: number, m2: number, colours: number): number {
  if (!(mass > m1 + m2)) return 0;
  const M2 = mass * mass;
  const a = (m1 * m1) / M2;
  const b = (m2 * m2) / M2;
  const lambda = kallen(1, a, b);
  if (!(lambda > 0)) return 0;
  const bracket = 1 - (a + b) / 2 - ((a - b) * (a - b)) / 2;
  const coupling = (gLeft * gLeft + gRight * gRight) * bracket + (6 * gLeft * gRight * m1 * m2) / M2;
  return (colours * mass * Math.sqrt(lambda) * coupling) / (24 * Math.PI);
}

/**
 * Width (GeV) of V -> S1 S2* through -i g (k1 - k2)^mu; zero below threshold.
 *
 * @example
 * vectorToScalarsWidth(1000, 1, 0, 0) // 1000 / (48 pi) = 6.6315 GeV
 */
export function vectorToScalarsWidth(mass: number, g: number, m1: number, m2: number): number {
  if (!(mass > m1 + m2)) return 0;
  const M2 = mass * mass;
  const lambda = kallen(1, (m1 * m1) / M2, (m2 * m2) / M2);
  if (!(lambda > 0)) return 0;
  return (g * g * mass * lambda * Math.sqrt(lambda)) / (48 * Math.PI);
}
