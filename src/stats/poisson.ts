/**
 * Poisson probabilities in log space, accurate from tiny means to means of
 * 1e6 and beyond, for counts where the probabilities underflow a double.
 *
 * P(N <= n | lambda) is the regularised upper incomplete gamma function
 * Q(n + 1, lambda) (Abramowitz and Stegun, formula numbers from memory: 6.5.2
 * and 26.4.21). jstat's
 * `lowRegGamma` gives the same quantity in linear space; the CLs ratio needs
 * the logarithm of both tails when they are far below 1e-308 (n = 0 with
 * b = 1e6 has P = e^-1e6), so the two sums are written here in log form:
 * the upper-tail series of P(a, x) when lambda < n + 1, and when
 * lambda >= n + 1 the finite Poisson sum taken from its largest term downwards
 * (n <= 100) or the continued fraction of Q (n > 100). Numerical Recipes
 * (3rd ed., section 6.2, from memory) splits the two regimes at the same place.
 */
import jStat from 'jstat';

const LOG_FACTORIAL_TABLE_SIZE = 1024;
const logFactorialTable = new Float64Array(LOG_FACTORIAL_TABLE_SIZE);
{
  // Compensated (Kahan) running sum of ln k: correct to the last digit or two.
  let sum = 0;
  let compensation = 0;
  for (let k = 2; k < LOG_FACTORIAL_TABLE_SIZE; k++) {
    const y = Math.log(k) - compensation;
    const t = sum + y;
    compensation = t - sum - y;
    sum = t;
    logFactorialTable[k] = sum;
  }
}
const HALF_LOG_TWO_PI = 0.5 * Math.log(2 * Math.PI);

/** Relative size below which a term no longer changes a double-precision sum. */
const SUM_EPSILON = 1e-17;
/**
 * Safety cap on series and continued-fraction terms: they converge in
 * ~10 sqrt(n) steps (~10^4 at n = 10^6); the cap only guards against a rounding
 * cycle when the arguments exceed 2^53.
 */
const MAX_TERMS = 10_000_000;
/** Above this count the lower tail uses the continued fraction instead of the finite sum. */
const DIRECT_SUM_MAX_COUNT = 100;

/**
 * ln(k!) for a whole number k >= 0: a table below 1024 and Stirling's series
 * ln Gamma(x) = (x - 1/2) ln x - x + ln(2 pi)/2 + 1/(12x) - 1/(360x^3) + 1/(1260x^5)
 * above (Abramowitz and Stegun 6.1.41, formula number from memory; the next
 * term is below 1e-18 there; checked against jstat's log-gamma in the tests).
 *
 * @example
 * logFactorial(5) // 4.787491742782046 (ln 120)
 */
export function logFactorial(k: number): number {
  if (k < LOG_FACTORIAL_TABLE_SIZE) return logFactorialTable[k];
  const x = k + 1;
  const inverse = 1 / x;
  const inverse2 = inverse * inverse;
  return (x - 0.5) * Math.log(x) - x + HALF_LOG_TWO_PI + inverse * (1 / 12 - inverse2 * (1 / 360 - inverse2 / 1260));
}

/**
 * ln P(N = k | mean) for a whole number k >= 0 and mean >= 0.
 *
 * @example
 * logPoissonPmf(0, 3) // -3
 */
export function logPoissonPmf(k: number, mean: number): number {
  if (mean === 0) return k === 0 ? 0 : Number.NEGATIVE_INFINITY;
  return k * Math.log(mean) - mean - logFactorial(k);
}

/**
 * ln P(N <= n | mean): the log of the Poisson cumulative probability, finite
 * for every whole n >= 0 and finite mean >= 0 (relative accuracy ~1e-14).
 *
 * @example
 * logPoissonCdf(0, 1e6) // -1000000
 */
export function logPoissonCdf(n: number, mean: number): number {
  if (n < 0) return Number.NEGATIVE_INFINITY;
  if (mean === 0) return 0;
  const a = n + 1;
  if (mean < a) {
    // Upper tail P(N > n) = P(a, mean) = e^-mean mean^a / a! * sum_k mean^k / ((a+1)...(a+k)).
    let term = 1;
    let sum = 1;
    for (let k = 1; k < MAX_TERMS; k++) {
      term *= mean / (a + k);
      sum += term;
      if (term < SUM_EPSILON * sum) break;
    }
    const upperTail = Math.exp(a * Math.log(mean) - mean - logFactorial(a) + Math.log(sum));
    return Math.log1p(-upperTail);
  }
  if (n > DIRECT_SUM_MAX_COUNT) return logUpperGammaContinuedFraction(a, mean);
  // P(N <= n) = P(N = n) * sum_{m=0..n} n! / ((n-m)! mean^m); the terms fall
  // at least as fast as (n / mean)^m.
  let term = 1;
  let sum = 1;
  for (let m = 0; m < n; m++) {
    term *= (n - m) / mean;
    sum += term;
    if (term < SUM_EPSILON * sum) break;
  }
  return logPoissonPmf(n, mean) + Math.log(sum);
}

/**
 * ln Q(a, x) for whole a >= 1 and x >= a by the continued fraction of
 * Numerical Recipes (3rd ed., eq. 6.2.7, number from memory) evaluated with the modified Lentz
 * method; it needs ~sqrt(a) steps at x = a, ten times fewer than the sum.
 */
function logUpperGammaContinuedFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < MAX_TERMS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 4e-16) break;
  }
  return -x + a * Math.log(x) - logFactorial(a - 1) + Math.log(h);
}

/**
 * P(N <= n | mean).
 *
 * @example
 * poissonCdf(2, 1) // 0.9196986029286058 (e^-1 (1 + 1 + 1/2))
 */
export function poissonCdf(n: number, mean: number): number {
  return Math.exp(logPoissonCdf(n, mean));
}

const normalQuantileCache = new Map<number, number>();

/** Phi^-1(p) through jstat, remembered for the few probabilities the bands use. */
function standardNormalQuantile(p: number): number {
  let z = normalQuantileCache.get(p);
  if (z === undefined) {
    z = jStat.normal.inv(p, 0, 1);
    if (normalQuantileCache.size < 64) normalQuantileCache.set(p, z);
  }
  return z;
}

/**
 * The smallest whole k with P(N <= k | mean) >= p, for p in (0, 1): the
 * p-quantile of the Poisson distribution. Starts from the Cornish-Fisher
 * normal approximation and steps to the exact answer.
 *
 * @example
 * poissonQuantile(0.5, 3) // 3
 */
export function poissonQuantile(p: number, mean: number): number {
  if (mean === 0 || p <= 0) return 0;
  const logP = Math.log(p);
  const z = standardNormalQuantile(p);
  let k = Math.max(0, Math.floor(mean + Math.sqrt(mean) * z + (z * z - 1) / 6));
  if (logPoissonCdf(k, mean) >= logP) {
    while (k > 0 && logPoissonCdf(k - 1, mean) >= logP) k--;
  } else {
    do k++;
    while (logPoissonCdf(k, mean) < logP);
  }
  return k;
}
