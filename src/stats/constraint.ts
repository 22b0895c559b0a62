/**
 * How one nuisance parameter theta, constrained by a unit normal
 * distribution, moves a region's background and signal.
 *
 * Background b with absolute uncertainty db (common practice for counting
 * experiments; for small db/b every convention agrees to O((db/b)^2)):
 * - log-normal: B(theta) = b * kappa^theta with kappa = 1 + db/b, so b is the
 *   median and the background can never turn negative;
 * - Gaussian truncated at zero: B(theta) = b + db * theta restricted to B >= 0,
 *   i.e. theta >= -b/db.
 * A log-normal cannot describe a zero central value, so a region with b = 0 and
 * db > 0 always uses the truncated Gaussian (a half-normal spread above zero).
 *
 * Signal s with relative uncertainty r is always log-normal,
 * S(theta_s) = s * (1 + r)^theta_s: a Gaussian signal factor reaches zero at
 * finite theta_s, and with r near 100% the profile likelihood could then
 * "explain away" any signal, leaving no finite limit.
 */
import type { RandomStream } from '../physics/random.js';
import type { UncertaintyModel } from './types.js';

/** The background of this region is known exactly. */
export const FIXED_BACKGROUND = 0;
/** The background is log-normal around its central value. */
export const LOG_NORMAL_BACKGROUND = 1;
/** The background is Gaussian, truncated at zero. */
export const GAUSSIAN_BACKGROUND = 2;

/** FIXED_BACKGROUND, LOG_NORMAL_BACKGROUND or GAUSSIAN_BACKGROUND. */
export type BackgroundKind = 0 | 1 | 2;

/**
 * Which response a region's background uncertainty gets.
 *
 * @example
 * backgroundKind(0, 0.5, 'lognormal') // 2 (GAUSSIAN_BACKGROUND: a log-normal needs b > 0)
 */
export function backgroundKind(background: number, uncertainty: number, model: UncertaintyModel): BackgroundKind {
  if (uncertainty === 0) return FIXED_BACKGROUND;
  if (model === 'gaussian' || background === 0) return GAUSSIAN_BACKGROUND;
  return LOG_NORMAL_BACKGROUND;
}

/**
 * ln(kappa) of the log-normal background response, ln(1 + db/b) (0 when not log-normal).
 *
 * @example
 * logKappa(10, 10) // 0.6931471805599453
 */
export function logKappa(background: number, uncertainty: number): number {
  return background > 0 && uncertainty > 0 ? Math.log1p(uncertainty / background) : 0;
}

/**
 * The background B(theta) of one region.
 *
 * @example
 * backgroundAt(LOG_NORMAL_BACKGROUND, 10, 10, Math.log(2), 1) // 20
 */
export function backgroundAt(kind: BackgroundKind, background: number, uncertainty: number, lnKappa: number, theta: number): number {
  if (kind === LOG_NORMAL_BACKGROUND) return background * Math.exp(lnKappa * theta);
  if (kind === GAUSSIAN_BACKGROUND) return Math.max(0, background + uncertainty * theta);
  return background;
}

/**
 * The lowest theta allowed by a truncated-Gaussian background, -b/db
 * (-Infinity for the other kinds).
 *
 * @example
 * thetaLowerBound(GAUSSIAN_BACKGROUND, 4, 2) // -2
 */
export function thetaLowerBound(kind: BackgroundKind, background: number, uncertainty: number): number {
  return kind === GAUSSIAN_BACKGROUND ? -background / uncertainty : Number.NEGATIVE_INFINITY;
}

/**
 * A unit normal deviate restricted to theta >= lowerBound (lowerBound <= 0,
 * so simple rejection accepts at least half of the draws).
 */
export function sampleTruncatedNormal(rng: RandomStream, lowerBound: number): number {
  if (lowerBound === Number.NEGATIVE_INFINITY) return rng.normal();
  let z = rng.normal();
  while (z < lowerBound) z = rng.normal();
  return z;
}
