/**
 * CLs for one counting region with pseudo-experiments that marginalise the
 * nuisance parameters over their constraints (the hybrid Bayesian-frequentist
 * treatment, R. D. Cousins and V. L. Highland, Nucl. Instrum. Meth. A320
 * (1992) 331, reference from memory; common practice for CLs with
 * systematic uncertainties), with the
 * observed count n as test statistic (for one region every likelihood-ratio
 * statistic orders outcomes like n):
 *
 *   CLs(s) = E_theta[P(N <= n | s f + b')] / E_theta[P(N <= n | b')].
 *
 * Each pseudo-experiment draws (b', f) from the constraints; the Poisson part
 * of the experiment is then summed exactly rather than drawn (conditional
 * Monte Carlo: the same expectation as drawing N, with a smaller variance, and
 * a CLs curve that is smooth in s so the root finder converges cleanly).
 *
 * The number of pseudo-experiments grows until the standard error of CLs at
 * the observed limit is below the tolerance (delta method for the ratio of two
 * correlated means, `toyErrors.ts`); that error is reported. The expected
 * limits use the same final ensemble.
 */
import type { RandomStream } from '../physics/random.js';
import { exactUpperLimit } from './clsExact.js';
import { evaluateMixtureCdf, mixtureQuantiles, type MixturePoint } from './mixtureCdf.js';
import { NuisanceEnsemble } from './nuisanceEnsemble.js';
import { poissonQuantile } from './poisson.js';
import { ratioStandardError } from './toyErrors.js';
import { findRootNewtonFromGuess } from './newtonRootFinding.js';
import type { ValueAndSlope } from './rootFinding.js';
import { bandProbabilities, makeMonotone } from './expectedBands.js';
import { BAND_KEYS, type ExpectedLimits, type UncertaintyModel } from './types.js';

export interface ToySettings {
  cl: number;
  uncertaintyModel: UncertaintyModel;
  rng: RandomStream;
  tolerance: number;
  minToys: number;
  maxToys: number;
}

export interface ToyLimits {
  observed: number;
  expected: ExpectedLimits;
  clsAtLimitError: number;
  toys: number;
}

class SingleRegionToys {
  private readonly ensemble: NuisanceEnsemble;
  private termsSignal = new Float64Array(0);
  private termsBackground = new Float64Array(0);
  private readonly point: MixturePoint = { logValue: 0, logSlope: 0 };

  constructor(
    private readonly observed: number,
    private readonly background: number,
    uncertainty: number,
    signalUncertainty: number,
    private readonly settings: ToySettings,
  ) {
    this.ensemble = new NuisanceEnsemble(settings.rng, background, uncertainty, signalUncertainty, settings.uncertaintyModel);
  }

  private evaluate(n: number, s: number, terms: Float64Array): MixturePoint {
    const e = this.ensemble;
    const largestMean = s * e.largestSignalFactor + e.largestBackground;
    return evaluateMixtureCdf(n, s, e.backgrounds, e.signalFactors, e.size, largestMean, terms, this.point);
  }

  /** The limit at count n with the current draws, and the CLs error there. */
  private limitAt(n: number, guess: number): { limit: number; error: number } {
    const size = this.ensemble.size;
    const logAlpha = Math.log1p(-this.settings.cl);
    const background = this.termsBackground.subarray(0, size);
    const signal = this.termsSignal.subarray(0, size);
    const target = this.evaluate(n, 0, background).logValue + logAlpha;
    let lastValue = 0;
    const evaluate = (s: number, out: ValueAndSlope): void => {
      const point = this.evaluate(n, s, signal);
      out.value = point.logValue - target;
      out.slope = point.logSlope;
      lastValue = out.value;
    };
    const limit = findRootNewtonFromGuess(evaluate, guess, -logAlpha, { absolute: 1e-10, relative: 1e-7 });
    // The terms of the last evaluation sit within the root tolerance of the limit: good enough for its error.
    const cls = Math.exp(lastValue + logAlpha);
    return { limit, error: ratioStandardError(signal, background, cls) };
  }

  run(): ToyLimits {
    const { minToys, maxToys, tolerance, cl } = this.settings;
    const probabilities = bandProbabilities();
    const nominalQuantiles = probabilities.map((p) => poissonQuantile(p, this.background));
    const guesses = new Map<number, number>();
    let size = Math.min(minToys, maxToys);
    for (;;) {
      this.ensemble.grow(size);
      if (this.termsSignal.length < size) {
        this.termsSignal = new Float64Array(Math.max(size, 2 * this.termsSignal.length));
        this.termsBackground = new Float64Array(this.termsSignal.length);
      }
      const e = this.ensemble;
      const limits = new Map<number, { limit: number; error: number }>();
      const limitAt = (n: number): { limit: number; error: number } => {
        let result = limits.get(n);
        if (result === undefined) {
          result = this.limitAt(n, guesses.get(n) ?? exactUpperLimit(n, this.background, cl));
          limits.set(n, result);
          guesses.set(n, result.limit);
        }
        return result;
      };
      const observed = limitAt(this.observed);
      if (observed.error <= tolerance || size >= maxToys) {
        // The bands come from the final ensemble; their own errors are not held to the tolerance.
        const counts = mixtureQuantiles(probabilities, e.backgrounds, size, e.largestBackground, nominalQuantiles);
        const expected = { minus2: 0, minus1: 0, median: 0, plus1: 0, plus2: 0 };
        counts.forEach((n, k) => {
          expected[BAND_KEYS[k]] = limitAt(n).limit;
        });
        makeMonotone(expected);
        return { observed: observed.limit, expected, clsAtLimitError: observed.error, toys: size };
      }
      const largestError = observed.error;
      // The error falls like 1/sqrt(K): jump to the size that should reach the tolerance.
      const needed = Math.ceil(1.2 * size * (largestError / tolerance) ** 2);
      size = Math.min(maxToys, Math.max(2 * size, needed));
    }
  }
}

/**
 * Observed and expected CLs limits on the signal count of one region from
 * pseudo-experiments (see the module comment).
 */
export function toyLimitsSingleRegion(
  observed: number,
  background: number,
  uncertainty: number,
  signalUncertainty: number,
  settings: ToySettings,
): ToyLimits {
  return new SingleRegionToys(observed, background, uncertainty, signalUncertainty, settings).run();
}
