/**
 * q qbar(') -> V* -> S1 S2*: a pair of complex scalars through s-channel vectors.
 *
 * With massless quarks of helicity lambda and the amplitude sum
 * A_lambda = sum_V c_q,lambda^V g_S^V P_V(s) (quark current -i c gamma^mu P_lambda,
 * scalar current -i g_S (k1 - k2)^mu, propagator P_V = 1/(s - M_V^2 + i s Gamma_V/M_V)),
 * the trace gives sum |M_lambda|^2 = |A_lambda|^2 s^2 betabar^2 sin^2 theta, with
 * betabar = lambda^(1/2)(1, m1^2/s, m2^2/s) and theta the angle between the quark and S1 in the
 * pair rest frame (derivation: the quark tensor 2(p1^mu p2^nu + p2^mu p1^nu - g^mu nu p1.p2)
 * contracted with (k1 - k2)_mu (k1 - k2)_nu). Averaging over quark spins (1/4) and colours
 * (1/N_c) and dsigma/dcos theta = |M|^2 betabar / (32 pi s) (two-body phase space, PDG
 * Review "Kinematics") give
 *
 *   dsigma/dcos theta = betabar^3 s (|A_L|^2 + |A_R|^2) (1 - cos^2 theta) / (128 pi N_c).
 *
 * For the photon alone with N_c = 1 this is the sin^2 theta law with the total
 * pi alpha^2 Q^2 beta^3 / (3 s) = beta^3/4 x 4 pi alpha^2 / (3 s) (tests/generator/processes.test.ts).
 */

/**
 * Writes dsigma/dcos theta = a0 + a1 c + a2 c^2 (GeV^-2) of a scalar pair at `out[offset..offset+2]`.
 * `a2L`, `a2R` are |A_L|^2, |A_R|^2 in GeV^-4; `betaBar` = lambda^(1/2)(1, m1^2/s, m2^2/s).
 *
 * @example
 * const out = new Float64Array(3);
 * scalarPairCoefficients(1, 1, 1, 1, 1, out, 0); // out = [0.0049736, 0, -0.0049736] (= 2 / (128 pi))
 */
export function scalarPairCoefficients(s: number, betaBar: number, a2L: number, a2R: number, colours: number, out: Float64Array, offset: number): void {
  const k = (betaBar * betaBar * betaBar * s * (a2L + a2R)) / (128 * Math.PI * colours);
  out[offset] = k;
  out[offset + 1] = 0;
  out[offset + 2] = -k;
}
