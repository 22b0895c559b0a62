/**
 * Breit-Wigner sampling of a squared mass s = m^2.
 *
 * Fixed-width relativistic Breit-Wigner in s, dP/ds ∝ 1 / ((s - M^2)^2 + M^2 Gamma^2)
 * (common practice for resonance line shapes; PDG Review, "Kinematics" and the
 * resonance mini-reviews), truncated to [sLow, sHigh]. The substitution
 * s = M^2 + M Gamma tan(theta) makes theta uniform, so sampling is exact and
 * allocation-free.
 */
import type { RandomStream } from '../../physics/random.js';

/**
 * Draws s from the fixed-width Breit-Wigner of mass `m` and width `width`
 * (GeV) truncated to [sLow, sHigh] (GeV^2). Returns s in GeV^2.
 *
 * @example
 * // A Z line shape restricted to 80-100 GeV:
 * // sampleBreitWignerS(91.188, 2.4955, 6400, 10000, rng) // a value in [6400, 10000]
 */
export function sampleBreitWignerS(m: number, width: number, sLow: number, sHigh: number, rng: RandomStream): number {
  const mGamma = m * width;
  const m2 = m * m;
  const thetaLow = Math.atan((sLow - m2) / mGamma);
  const thetaHigh = Math.atan((sHigh - m2) / mGamma);
  const s = m2 + mGamma * Math.tan(thetaLow + (thetaHigh - thetaLow) * rng.uniform());
  // Guard the ends against rounding in tan(atan(x)).
  return s < sLow ? sLow : s > sHigh ? sHigh : s;
}

/**
 * The Breit-Wigner density of s normalised on [sLow, sHigh]:
 * (M Gamma / ((s - M^2)^2 + M^2 Gamma^2)) / (atan((sHigh - M^2)/(M Gamma)) - atan((sLow - M^2)/(M Gamma))).
 * Used by tests and by callers that need the probability of a range.
 */
export function breitWignerDensityS(m: number, width: number, sLow: number, sHigh: number, s: number): number {
  if (s < sLow || s > sHigh) return 0;
  const mGamma = m * width;
  const m2 = m * m;
  const norm = Math.atan((sHigh - m2) / mGamma) - Math.atan((sLow - m2) / mGamma);
  return mGamma / ((s - m2) * (s - m2) + mGamma * mGamma) / norm;
}
