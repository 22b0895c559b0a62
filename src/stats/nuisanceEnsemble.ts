/**
 * Draws of one region's nuisance parameters from their constraints: for each
 * pseudo-experiment a background B(theta) and a signal factor (1 + r)^theta_s,
 * theta and theta_s unit normal (truncated for a Gaussian background). Kept in
 * growing typed arrays so that adding pseudo-experiments keeps the earlier ones
 * (the same seed gives the same first K draws whatever the final K).
 */
import type { RandomStream } from '../physics/random.js';
import { backgroundAt, backgroundKind, logKappa, sampleTruncatedNormal, thetaLowerBound, type BackgroundKind } from './constraint.js';
import type { UncertaintyModel } from './types.js';

export class NuisanceEnsemble {
  private backgroundDraws = new Float64Array(0);
  private signalDraws = new Float64Array(0);
  private count = 0;
  private readonly kind: BackgroundKind;
  private readonly lnKappa: number;
  private readonly lowerBound: number;
  private readonly lnSignalFactor: number;
  /** Largest background and signal factor drawn so far. */
  largestBackground = 0;
  largestSignalFactor = 1;

  constructor(
    private readonly rng: RandomStream,
    private readonly background: number,
    private readonly uncertainty: number,
    signalUncertainty: number,
    model: UncertaintyModel,
  ) {
    this.kind = backgroundKind(background, uncertainty, model);
    this.lnKappa = logKappa(background, uncertainty);
    this.lowerBound = thetaLowerBound(this.kind, background, uncertainty);
    this.lnSignalFactor = Math.log1p(signalUncertainty);
    this.largestBackground = background;
  }

  get size(): number {
    return this.count;
  }

  /** Background of draw k. */
  get backgrounds(): Float64Array {
    return this.backgroundDraws;
  }

  /** Signal factor of draw k (1 without signal uncertainty). */
  get signalFactors(): Float64Array {
    return this.signalDraws;
  }

  /** Makes sure that at least `size` draws exist. */
  grow(size: number): void {
    if (size <= this.count) return;
    if (size > this.backgroundDraws.length) {
      const capacity = Math.max(size, 2 * this.backgroundDraws.length);
      const backgrounds = new Float64Array(capacity);
      backgrounds.set(this.backgroundDraws.subarray(0, this.count));
      const signals = new Float64Array(capacity);
      signals.set(this.signalDraws.subarray(0, this.count));
      this.backgroundDraws = backgrounds;
      this.signalDraws = signals;
    }
    for (let k = this.count; k < size; k++) {
      const theta = this.uncertainty > 0 ? sampleTruncatedNormal(this.rng, this.lowerBound) : 0;
      const b = backgroundAt(this.kind, this.background, this.uncertainty, this.lnKappa, theta);
      const f = this.lnSignalFactor > 0 ? Math.exp(this.lnSignalFactor * this.rng.normal()) : 1;
      this.backgroundDraws[k] = b;
      this.signalDraws[k] = f;
      if (b > this.largestBackground) this.largestBackground = b;
      if (f > this.largestSignalFactor) this.largestSignalFactor = f;
    }
    this.count = size;
  }
}
