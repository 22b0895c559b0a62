/**
 * CLs for several disjoint regions from pseudo-experiments (T. Junk, Nucl.
 * Instrum. Meth. A434 (1999) 435; A. L. Read, J. Phys. G 28 (2002) 2693).
 *
 * Test statistic: the log-likelihood ratio of signal-plus-background to
 * background-only with the nuisance parameters at their nominal values
 * (Junk 1999), which up to a constant is t(mu) = sum_i n_i w_i with
 * w_i = ln(1 + mu s_i / b_i); larger t is more signal-like and
 * CLs = P(t <= t_obs | mu) / P(t <= t_obs | 0). A region with b_i = 0 gets
 * b_i = 1e-6 events in its weight: an event there counts as strongly signal-like.
 *
 * Each pseudo-experiment draws one nuisance parameter per correlation group and
 * one signal nuisance per region from their constraints (hybrid marginalisation,
 * Cousins and Highland, Nucl. Instrum. Meth. A320 (1992) 331, reference from
 * memory), a background-only
 * count per region (`samplePoisson`), and a signal count per region by inversion
 * of a stored uniform u, kept as E = -ln u (`poissonInverse`), so the ensemble is the same at every mu
 * (common random numbers) and the CLs curve has no random jitter between mu values.
 *
 * Expected bands: at each mu the p = Phi(N) quantile t_p of the background-only
 * distribution of t replaces t_obs (common practice), which gives
 * CLs_N(mu) = P(t <= t_p | mu) / P(t <= t_p | 0); each band edge solves
 * CLs_N(mu) = alpha.
 */
import { quickselect } from 'simple-statistics';
import type { RandomStream } from '../physics/random.js';
import { sampleTruncatedNormal } from './constraint.js';
import type { CountingModel } from './countingModel.js';
import { poissonInverse, samplePoisson } from './poissonSampling.js';
import { bracketNear, findRootBisection } from './rootFinding.js';
import { ratioStandardError } from './toyErrors.js';
import { bandProbabilities, makeMonotone } from './expectedBands.js';
import { BAND_KEYS } from './types.js';
import type { ToyLimits, ToySettings } from './clsToysSingle.js';

/** Background used in the weight of a region with no background, in events. */
const WEIGHT_BACKGROUND_FLOOR = 1e-6;
/**
 * Most (pseudo-experiment, region) pairs kept in memory: three doubles each,
 * so 48 MB; with 40 regions that allows 50 000 pseudo-experiments.
 */
const MAX_STORED_COUNTS = 2_000_000;
/** Toy limits carry a Monte Carlo error of ~1%: locating the crossing to 5e-4 (relative) is plenty. */
const TOY_ROOT_TOLERANCE = { absolute: 1e-12, relative: 5e-4 };

/**
 * The p-quantile of `values` with linear interpolation between order
 * statistics (type 7 of R, the convention of simple-statistics' quantileSorted),
 * found in O(K) by Floyd-Rivest selection (simple-statistics' quickselect); reorders `values`.
 */
export function quantileInPlace(values: Float64Array, p: number): number {
  const position = (values.length - 1) * p;
  const lower = Math.floor(position);
  quickselect(values as unknown as number[], lower);
  const lowerValue = values[lower];
  if (position === lower) return lowerValue;
  let next = Number.POSITIVE_INFINITY;
  for (let k = lower + 1; k < values.length; k++) if (values[k] < next) next = values[k];
  return lowerValue + (position - lower) * (next - lowerValue);
}

class CombinedToys {
  private size = 0;
  private signalMeans = new Float64Array(0);
  private backgroundCounts = new Float64Array(0);
  /** -ln u of the uniform that fixes each signal count by inversion. */
  private signalExponentials = new Float64Array(0);
  private readonly uniforms: RandomStream;
  private readonly weights: Float64Array;
  private readonly groupTheta: Float64Array;
  private backgroundStatistic = new Float64Array(0);
  private quantileScratch = new Float64Array(0);
  private signalStatistic = new Float64Array(0);
  private tailSignal = new Float64Array(0);
  private tailBackground = new Float64Array(0);

  constructor(private readonly model: CountingModel, private readonly settings: ToySettings) {
    this.uniforms = settings.rng.split();
    this.weights = new Float64Array(model.regionCount);
    this.groupTheta = new Float64Array(model.groupCount);
  }

  /** Adds pseudo-experiments up to `size` (earlier ones are kept). */
  private grow(size: number): void {
    const m = this.model;
    const regions = m.regionCount;
    if (size * regions > this.signalMeans.length) {
      const capacity = Math.max(size * regions, 2 * this.signalMeans.length);
      const means = new Float64Array(capacity);
      means.set(this.signalMeans.subarray(0, this.size * regions));
      const counts = new Float64Array(capacity);
      counts.set(this.backgroundCounts.subarray(0, this.size * regions));
      const exponentials = new Float64Array(capacity);
      exponentials.set(this.signalExponentials.subarray(0, this.size * regions));
      this.signalMeans = means;
      this.backgroundCounts = counts;
      this.signalExponentials = exponentials;
      const perToy = capacity / regions;
      this.backgroundStatistic = new Float64Array(perToy);
      this.quantileScratch = new Float64Array(perToy);
      this.signalStatistic = new Float64Array(perToy);
      this.tailSignal = new Float64Array(perToy);
      this.tailBackground = new Float64Array(perToy);
    }
    const rng = this.settings.rng;
    for (let k = this.size; k < size; k++) {
      for (let g = 0; g < m.groupCount; g++) {
        this.groupTheta[g] = m.groupFree[g] === 1 ? sampleTruncatedNormal(rng, m.groupLowerBound[g]) : 0;
      }
      for (let i = 0; i < regions; i++) {
        // A region without signal has weight 0 in t: nothing to draw.
        if (m.signal[i] === 0) continue;
        const background = m.backgroundOf(i, this.groupTheta[m.group[i]]);
        const factor = m.lnSignalFactor[i] > 0 ? Math.exp(m.lnSignalFactor[i] * rng.normal()) : 1;
        this.signalMeans[k * regions + i] = m.signal[i] * factor;
        this.backgroundCounts[k * regions + i] = samplePoisson(rng, background);
        this.signalExponentials[k * regions + i] = -Math.log(this.uniforms.uniformOpen());
      }
    }
    this.size = size;
  }

  /**
   * Fills the test statistic of every pseudo-experiment at mu (background-only
   * and signal-plus-background) and returns t_obs.
   */
  private fillStatistics(mu: number): number {
    const m = this.model;
    const regions = m.regionCount;
    let observed = 0;
    for (let i = 0; i < regions; i++) {
      this.weights[i] = Math.log1p((mu * m.signal[i]) / Math.max(m.background[i], WEIGHT_BACKGROUND_FLOOR));
      observed += this.weights[i] * m.observed[i];
    }
    for (let k = 0; k < this.size; k++) {
      let background = 0;
      let signal = 0;
      const offset = k * regions;
      for (let i = 0; i < regions; i++) {
        if (m.signal[i] === 0) continue;
        const w = this.weights[i];
        background += w * this.backgroundCounts[offset + i];
        // Inversion with u = e^-E: the count is 0 exactly when the mean is <= E, which needs no exponential.
        const mean = mu * this.signalMeans[offset + i];
        const exponential = this.signalExponentials[offset + i];
        if (mean > exponential) signal += w * poissonInverse(Math.exp(-exponential), mean);
      }
      this.backgroundStatistic[k] = background;
      this.signalStatistic[k] = background + signal;
    }
    return observed;
  }

  /** CLs at mu for the threshold t_obs (band < 0) or the band's quantile threshold; fills the tail indicators. */
  private cls(mu: number, band: number, probabilities: readonly number[]): number {
    let threshold = this.fillStatistics(mu);
    const size = this.size;
    if (band >= 0) {
      const scratch = this.quantileScratch.subarray(0, size);
      scratch.set(this.backgroundStatistic.subarray(0, size));
      threshold = quantileInPlace(scratch, probabilities[band]);
    }
    // Statistics built from the same counts and weights compare exactly; the margin only absorbs summation order.
    const cut = threshold + 1e-12 * Math.abs(threshold);
    let signalTail = 0;
    let backgroundTail = 0;
    for (let k = 0; k < size; k++) {
      const a = this.signalStatistic[k] <= cut ? 1 : 0;
      const c = this.backgroundStatistic[k] <= cut ? 1 : 0;
      this.tailSignal[k] = a;
      this.tailBackground[k] = c;
      signalTail += a;
      backgroundTail += c;
    }
    return backgroundTail > 0 ? signalTail / backgroundTail : 0;
  }

  /** The limit for one threshold (observed: band -1) and the CLs error there. */
  private limitFor(band: number, guess: number, probabilities: readonly number[]): { limit: number; error: number } {
    const alpha = 1 - this.settings.cl;
    const f = (mu: number): number => this.cls(mu, band, probabilities) - alpha;
    const limit = findRootBisection(f, bracketNear(f, guess, 1 - alpha, 1.2), TOY_ROOT_TOLERANCE);
    const cls = this.cls(limit, band, probabilities);
    const size = this.size;
    return { limit, error: ratioStandardError(this.tailSignal.subarray(0, size), this.tailBackground.subarray(0, size), cls) };
  }

  run(guess: number): ToyLimits {
    const { minToys, tolerance } = this.settings;
    const maxToys = Math.max(1, Math.min(this.settings.maxToys, Math.floor(MAX_STORED_COUNTS / this.model.regionCount)));
    const probabilities = bandProbabilities();
    let size = Math.min(minToys, maxToys);
    let observedGuess = guess;
    for (;;) {
      this.grow(size);
      const observed = this.limitFor(-1, observedGuess, probabilities);
      observedGuess = observed.limit;
      if (observed.error <= tolerance || size >= maxToys) {
        // The bands come from the final ensemble; their own errors are not held to the tolerance.
        const expected = { minus2: 0, minus1: 0, median: 0, plus1: 0, plus2: 0 };
        let bandGuess = observed.limit;
        BAND_KEYS.forEach((key, band) => {
          bandGuess = this.limitFor(band, bandGuess, probabilities).limit;
          expected[key] = bandGuess;
        });
        makeMonotone(expected);
        return { observed: observed.limit, expected, clsAtLimitError: observed.error, toys: size };
      }
      // The error falls like 1/sqrt(K): jump to the size that should reach the tolerance.
      const needed = Math.ceil(1.2 * size * (observed.error / tolerance) ** 2);
      size = Math.min(maxToys, Math.max(2 * size, needed));
    }
  }
}

/**
 * Observed and expected CLs limits on the signal strength mu of several regions
 * from pseudo-experiments; `guess` is a signal strength near the limit.
 */
export function toyLimitsCombined(model: CountingModel, settings: ToySettings, guess: number): ToyLimits {
  return new CombinedToys(model, settings).run(guess);
}
