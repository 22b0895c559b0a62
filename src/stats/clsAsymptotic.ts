/**
 * CLs upper limits from the asymptotic distribution of q~_mu (G. Cowan,
 * K. Cranmer, E. Gross, O. Vitells, Eur. Phys. J. C 71 (2011) 1554,
 * arXiv:1007.1727; Wald's approximation with the
 * "Asimov" data set giving sigma).
 *
 * The Asimov data set for the background-only hypothesis is each region's
 * nominal background, with the nuisance parameters at their nominal values
 * (the expected limits are "pre-fit": they do not depend on the observed
 * counts, so the best-expected-region rule cannot be steered by the data).
 * sigma^2 = mu^2 / q_mu,A, and with sqrt(q_mu,A) = mu / sigma:
 *
 *   CLs = [1 - Phi(sqrt(q))] / Phi(sqrt(q_A) - sqrt(q))               for q <= q_A,
 *   CLs = [1 - Phi((q + q_A) / (2 sqrt(q_A)))] / [1 - Phi((q - q_A) / (2 sqrt(q_A)))]  for q > q_A
 *
 * (the two branches of the distribution of q~_mu given there; the equation
 * numbers, (65) and (66), are from memory).
 * Expected band N (N = 0, ±1, ±2): mu_N = sigma (Phi^-1(1 - alpha Phi(N)) + N),
 * solved self-consistently because sigma depends on mu for Poisson counts.
 */
import jStat from 'jstat';
import type { CountingModel } from './countingModel.js';
import { ProfileFit } from './profileFit.js';
import { ProfileLikelihoodRatio } from './profileLikelihoodRatio.js';
import { expandBracketUpward, findRootBrent } from './rootFinding.js';
import { BAND_KEYS, BAND_SIGMAS, type ExpectedLimits } from './types.js';

const LIMIT_TOLERANCE = { absolute: 1e-12, relative: 1e-9 };

/**
 * 1 - Phi(x), the upper tail of the standard normal distribution.
 *
 * @example
 * normalUpperTail(1.959963984540054) // 0.025
 */
export function normalUpperTail(x: number): number {
  return 0.5 * jStat.erfc(x / Math.SQRT2);
}

/**
 * Asymptotic CLs from the observed q~_mu and the Asimov q_mu,A.
 *
 * @example
 * asymptoticCls(1.959963984540054 ** 2, 1.959963984540054 ** 2) // 0.05
 */
export function asymptoticCls(q: number, qAsimov: number): number {
  if (!(qAsimov > 0)) return 1;
  const rootQ = Math.sqrt(q);
  const rootQAsimov = Math.sqrt(qAsimov);
  let clsb: number;
  let clb: number;
  if (q <= qAsimov) {
    clsb = normalUpperTail(rootQ);
    clb = normalUpperTail(rootQ - rootQAsimov);
  } else {
    clsb = normalUpperTail((q + qAsimov) / (2 * rootQAsimov));
    clb = normalUpperTail((q - qAsimov) / (2 * rootQAsimov));
  }
  return clb > 0 ? clsb / clb : 0;
}

/**
 * sqrt(q_mu,A) at the N-sigma band edge of the expected limit:
 * Phi^-1(1 - alpha Phi(N)) + N with alpha = 1 - cl.
 *
 * @example
 * bandSignificance(0.95, 0) // 1.959963984540054
 */
export function bandSignificance(cl: number, sigmas: number): number {
  const alpha = 1 - cl;
  return jStat.normal.inv(1 - alpha * jStat.normal.cdf(sigmas, 0, 1), 0, 1) + sigmas;
}

/** A signal strength near the limit, to start the bracket: the best single region's rough reach. */
function firstGuess(model: CountingModel): number {
  let guess = Number.POSITIVE_INFINITY;
  for (let i = 0; i < model.regionCount; i++) {
    const s = model.signal[i];
    if (!(s > 0)) continue;
    const b = model.background[i];
    const reach = 3 + Math.max(model.observed[i] - b, 0) + 2 * Math.sqrt(b) + 2 * model.backgroundUncertainty[i];
    guess = Math.min(guess, reach / s);
  }
  return guess;
}

/**
 * Observed and expected asymptotic CLs upper limits on the signal strength mu
 * (multiples of the model's signal) at confidence level `cl`.
 */
export function asymptoticLimits(model: CountingModel, cl: number): { observed: number; expected: ExpectedLimits } {
  const alpha = 1 - cl;
  const guess = firstGuess(model);
  const asimov = new ProfileFit(model, model.background.slice());
  const asimovMinimum = asimov.profiledNll(0);
  const qAsimov = (mu: number): number => Math.max(0, 2 * (asimov.profiledNll(mu) - asimovMinimum));

  const ratio = new ProfileLikelihoodRatio(model, model.observed);
  const clsMinusAlpha = (mu: number): number => asymptoticCls(ratio.qTilde(mu), qAsimov(mu)) - alpha;
  const observed = findRootBrent(clsMinusAlpha, expandBracketUpward(clsMinusAlpha, 0, Math.max(guess, ratio.muHat)), LIMIT_TOLERANCE);

  asimov.reset();
  const expected = { minus2: 0, minus1: 0, median: 0, plus1: 0, plus2: 0 };
  let low = 0;
  for (let k = 0; k < BAND_KEYS.length; k++) {
    const target = bandSignificance(cl, BAND_SIGMAS[k]);
    const gap = (mu: number): number => target - Math.sqrt(qAsimov(mu));
    const root = findRootBrent(gap, expandBracketUpward(gap, low, Math.max(guess, 1.5 * low)), LIMIT_TOLERANCE);
    expected[BAND_KEYS[k]] = root;
    low = root;
  }
  return { observed, expected };
}
