/**
 * The profile likelihood ratio statistic q~_mu for upper limits (G. Cowan,
 * K. Cranmer, E. Gross, O. Vitells, Eur. Phys. J. C 71 (2011) 1554,
 * arXiv:1007.1727, the section on q~_mu for upper limits):
 *
 *   q~_mu = -2 ln [ L(mu, theta^^(mu)) / L(max(mu^, 0), theta^) ]   for mu^ <= mu,
 *   q~_mu = 0                                                        for mu^ > mu,
 *
 * where theta^^(mu) maximises L at fixed mu. Only mu >= 0 is ever fitted:
 * replacing mu^ < 0 by 0 in the denominator is exactly the "tilde" of q~.
 */
import type { CountingModel } from './countingModel.js';
import { ProfileFit } from './profileFit.js';
import { expandBracketUpward, findRootBrent } from './rootFinding.js';

export class ProfileLikelihoodRatio {
  readonly fit: ProfileFit;
  /** The best-fit signal strength restricted to mu >= 0. */
  readonly muHat: number;
  /** -ln L at (muHat, theta^), deviance form. */
  readonly nllAtMuHat: number;

  /** Fits `data` (counts per region of `model`) for mu^ >= 0 and its nuisance parameters. */
  constructor(model: CountingModel, data: Float64Array) {
    this.fit = new ProfileFit(model, data);
    const nllAtZero = this.fit.profiledNll(0);
    const slopeAtZero = this.fit.muSlope(0);
    if (Number.isFinite(nllAtZero) && slopeAtZero >= 0) {
      this.muHat = 0;
      this.nllAtMuHat = nllAtZero;
      return;
    }
    // The profiled -ln L decreases at mu = 0: the best fit is where its slope vanishes.
    const fit = this.fit;
    const descent = (mu: number): number => {
      fit.profiledNll(mu);
      return -fit.muSlope(mu);
    };
    let first = 0;
    let totalSignal = 0;
    for (let i = 0; i < model.regionCount; i++) {
      first += Math.max(data[i] - model.background[i], 0);
      totalSignal += model.signal[i];
    }
    first = Math.max(first, 1) / totalSignal;
    const bracket = expandBracketUpward(descent, 0, first);
    this.muHat = findRootBrent(descent, bracket, { absolute: 1e-14, relative: 1e-12 });
    this.nllAtMuHat = this.fit.profiledNll(this.muHat);
  }

  /**
   * q~_mu for mu >= 0 (0 when mu <= mu^).
   *
   * @example
   * // one region with n = 3, b = 3, s = 1 and no uncertainty (mu^ = 0):
   * ratio.qTilde(3) // 1.8411169166403 = 2 (6 - 3 - 3 ln 2)
   */
  qTilde(mu: number): number {
    if (mu <= this.muHat) return 0;
    const q = 2 * (this.fit.profiledNll(mu) - this.nllAtMuHat);
    return q > 0 ? q : 0;
  }
}
