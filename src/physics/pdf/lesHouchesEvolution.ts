/**
 * The Les Houches LO benchmark evolution (hep-ph/0204316, section 1.3):
 * the toy input at mu0^2 = 2 GeV^2, the benchmark's alpha_s and thresholds,
 * and the Mellin contours used to invert it, with a direct (grid-free)
 * evaluation used by the grid builder and by the tests as the reference.
 */
import { lesHouchesAlphaS } from '../alphaS.js';
import { type EvolutionSetup, evolveMoments } from './mellinEvolution.js';
import { type ContourBand, tabulateByMellinInversion } from './mellinTabulation.js';
import { LES_HOUCHES_MU0_SQUARED, lesHouchesInputMoment } from './lesHouchesInput.js';

/** Evolution settings of the benchmark: its input, mu0^2 = 2 GeV^2, its alpha_s and thresholds (nf = 4 from mu0, 5 from m_b = 4.5 GeV). */
export const lesHouchesEvolutionSetup: EvolutionSetup = {
  coupling: lesHouchesAlphaS,
  mu0Squared: LES_HOUCHES_MU0_SQUARED,
  inputMoment: lesHouchesInputMoment,
};

const PHI = 0.75 * Math.PI;

/**
 * Contours per x band, tuned for this input (tamis's own tuning). Measured against
 * contours of 480 points with the intercept c near the saddle point of each x, for
 * Q from 1.4 GeV to 10 TeV: every column agrees within 2e-8 relative up to x = 0.9
 * and 1.2e-7 up to x = 0.99 (tests/physics/pdfMellinInversion.test.ts asserts 1e-6);
 * at mu0 the input is recovered within 2e-9 up to x = 0.9. Far from x = 1 a small c
 * and a short contour suffice because x^(-N) damps the integrand; near x = 1 the
 * damping comes from the moments themselves and c moves right, towards the saddle
 * point (beta + 1) / ln(1/x).
 */
export const LES_HOUCHES_CONTOUR_BANDS: readonly ContourBand[] = [
  { xMax: 1e-2, shape: { c: 1.8, phi: PHI, zMax: 10, panels: 6, pointsPerPanel: 12, growth: 2 } },
  { xMax: 0.6, shape: { c: 4, phi: PHI, zMax: 60, panels: 6, pointsPerPanel: 12, growth: 2 } },
  { xMax: 0.9, shape: { c: 24, phi: PHI, zMax: 300, panels: 8, pointsPerPanel: 12, growth: 1.5 } },
  { xMax: 0.99, shape: { c: 200, phi: PHI, zMax: 3000, panels: 8, pointsPerPanel: 12, growth: 1.5 } },
];

/** Largest x evaluated by Mellin inversion; the grid extrapolates above it. */
export const LES_HOUCHES_X_TOP = 0.99;

/**
 * x f(x, Q) of the evolved benchmark densities, computed directly (no grid):
 * one Float64Array per column (order of FLAVOUR_KEYS) indexed [iq * xs.length + ix].
 * Slow compared with a grid lookup (about 0.1 ms per x and Q); meant for tables and checks.
 *
 * @example
 * lesHouchesXfDirect([0.1], [100])[0][0] // x g(0.1, 100 GeV) = 0.84358 (Table 2 of hep-ph/0204316)
 */
export function lesHouchesXfDirect(xs: ArrayLike<number>, qs: ArrayLike<number>): Float64Array[] {
  const lnQ2 = Array.from(qs as ArrayLike<number>, (q) => Math.log(q * q));
  return tabulateByMellinInversion(LES_HOUCHES_CONTOUR_BANDS, xs, lnQ2.length, (n) => evolveMoments(lesHouchesEvolutionSetup, n, lnQ2));
}
