/**
 * The binned Poisson likelihood of several disjoint counting regions with
 * constrained nuisance parameters, and its maximisation over the nuisance
 * parameters at fixed signal strength (the "profile").
 *
 * -ln L(mu, theta) = sum_i [lambda_i - n_i ln lambda_i] + sum_g theta_g^2 / 2 + sum_i theta_s,i^2 / 2
 * (constants dropped), with lambda_i = mu s_i S_i(theta_s,i) + B_i(theta_g(i)).
 * One theta_g per correlation group moves every background in the group
 * together (fully correlated); each region has its own signal nuisance. The
 * responses B and S are those of `constraint.ts`.
 *
 * Profiling separates by group: for fixed mu the group's theta_g couples only
 * to the signal nuisances of its own regions, so the Hessian is an "arrowhead"
 * (one dense row and column plus a diagonal) and a Newton step costs O(regions).
 * Newton steps are damped when the Hessian is not positive definite, projected
 * onto theta_g >= -b/db for truncated Gaussians, and accepted by backtracking.
 */
import { TamisError } from '../errors.js';
import { GAUSSIAN_BACKGROUND, LOG_NORMAL_BACKGROUND } from './constraint.js';
import type { CountingModel } from './countingModel.js';

const MAX_NEWTON_STEPS = 100;
const MAX_HALVINGS = 60;

/**
 * Profile fits of one data set under a `CountingModel`. Holds the nuisance
 * parameters between calls, so consecutive fits at nearby mu start warm.
 */
export class ProfileFit {
  readonly model: CountingModel;
  readonly data: Float64Array;
  /** Background nuisance per group. */
  readonly theta: Float64Array;
  /** Signal nuisance per region. */
  readonly thetaSignal: Float64Array;
  private readonly gradient: Float64Array;
  private readonly curvature: Float64Array;
  private readonly cross: Float64Array;
  private readonly step: Float64Array;
  private readonly trialSignal: Float64Array;
  private groupCurvature = 1;

  constructor(model: CountingModel, data: Float64Array) {
    this.model = model;
    this.data = data;
    this.theta = new Float64Array(model.groupCount);
    this.thetaSignal = new Float64Array(model.regionCount);
    this.gradient = new Float64Array(model.regionCount);
    this.curvature = new Float64Array(model.regionCount);
    this.cross = new Float64Array(model.regionCount);
    this.step = new Float64Array(model.regionCount);
    this.trialSignal = new Float64Array(model.regionCount);
  }

  /** Expected count lambda_i at (mu, theta_g, theta_s,i). */
  private expected(i: number, mu: number, thetaGroup: number, thetaSignal: number): number {
    const m = this.model;
    const s = mu * (m.signal[i]);
    const signal = s === 0 ? 0 : s * Math.exp((m.lnSignalFactor[i]) * thetaSignal);
    return signal + m.backgroundOf(i, thetaGroup);
  }

  /**
   * -ln L restricted to one group, at given nuisance values (signal nuisances
   * from `signalSource`), in deviance form: each region contributes
   * lambda - n - n ln(lambda / n) >= 0, which differs from lambda - n ln lambda by
   * a constant and keeps full precision at counts of 1e6.
   */
  private groupNll(g: number, mu: number, thetaGroup: number, signalSource: Float64Array): number {
    const m = this.model;
    let sum = 0.5 * thetaGroup * thetaGroup;
    for (let k = m.groupStart[g]; k < m.groupStart[g + 1]; k++) {
      const i = m.groupRegions[k];
      const ts = signalSource[i];
      const lambda = this.expected(i, mu, thetaGroup, ts);
      const n = this.data[i];
      if (n > 0) {
        if (!(lambda > 0)) return Number.POSITIVE_INFINITY;
        sum += lambda - n - n * Math.log(lambda / n);
      } else {
        sum += lambda;
      }
      sum += 0.5 * ts * ts;
    }
    return sum;
  }

  /** -ln L at (mu, current nuisances) without fitting. */
  nll(mu: number): number {
    let sum = 0;
    for (let g = 0; g < this.model.groupCount; g++) sum += this.groupNll(g, mu, this.theta[g], this.thetaSignal);
    return sum;
  }

  /** Sets every nuisance parameter back to its nominal value 0. */
  reset(): void {
    this.theta.fill(0);
    this.thetaSignal.fill(0);
  }

  /** min over the nuisance parameters of -ln L at this mu (the nuisances stay at the minimum). */
  profiledNll(mu: number): number {
    let sum = 0;
    for (let g = 0; g < this.model.groupCount; g++) sum += this.profileGroup(g, mu);
    return sum;
  }

  /**
   * d(-ln L)/d mu at the current nuisances; after `profiledNll(mu)` this is the
   * slope of the profiled curve (envelope theorem).
   */
  muSlope(mu: number): number {
    const m = this.model;
    let slope = 0;
    for (let i = 0; i < m.regionCount; i++) {
      const s = m.signal[i];
      if (s === 0) continue;
      const ts = this.thetaSignal[i];
      const factor = Math.exp((m.lnSignalFactor[i]) * ts);
      const lambda = this.expected(i, mu, this.theta[m.group[i]], ts);
      const n = this.data[i];
      if (n > 0 && !(lambda > 0)) return Number.NEGATIVE_INFINITY;
      slope += s * factor * (n > 0 ? 1 - n / lambda : 1);
    }
    return slope;
  }

  private profileGroup(g: number, mu: number): number {
    const m = this.model;
    const start = m.groupStart[g];
    const end = m.groupStart[g + 1];
    const groupFree = m.groupFree[g] === 1;
    const lowerBound = m.groupLowerBound[g];
    let hasSignalNuisance = false;
    for (let k = start; k < end; k++) {
      const i = m.groupRegions[k];
      if (m.lnSignalFactor[i] > 0 && mu * m.signal[i] > 0) hasSignalNuisance = true;
      else this.thetaSignal[i] = 0;
    }
    let thetaGroup = groupFree ? Math.max(lowerBound, this.theta[g]) : 0;
    let value = this.groupNll(g, mu, thetaGroup, this.thetaSignal);
    if (!groupFree && !hasSignalNuisance) {
      this.theta[g] = 0;
      return value;
    }
    if (!Number.isFinite(value)) {
      // A warm start can sit where some lambda is zero; restart inside the allowed range.
      thetaGroup = groupFree ? Math.max(0, lowerBound + 1) : 0;
      for (let k = start; k < end; k++) this.thetaSignal[m.groupRegions[k]] = 0;
      value = this.groupNll(g, mu, thetaGroup, this.thetaSignal);
      if (!Number.isFinite(value)) {
        this.theta[g] = thetaGroup;
        return value;
      }
    }
    for (let iteration = 0; iteration < MAX_NEWTON_STEPS; iteration++) {
      const gradientGroup = this.derivatives(g, mu, thetaGroup);
      const frozen = !groupFree || (thetaGroup <= lowerBound && gradientGroup > 0);
      const stepGroup = this.newtonStep(g, gradientGroup, frozen, hasSignalNuisance);
      // Predicted decrease of a full Newton step (half the Newton decrement squared).
      let predicted = -gradientGroup * stepGroup;
      for (let k = start; k < end; k++) predicted -= this.gradient[m.groupRegions[k]] * this.step[m.groupRegions[k]];
      if (!(predicted > 2e-15)) break;
      // Backtracking along the projected Newton path.
      let t = 1;
      let nextTheta = thetaGroup;
      let nextValue = Number.POSITIVE_INFINITY;
      for (let halving = 0; halving < MAX_HALVINGS; halving++) {
        nextTheta = frozen ? thetaGroup : Math.max(lowerBound, thetaGroup + t * stepGroup);
        for (let k = start; k < end; k++) {
          const i = m.groupRegions[k];
          this.trialSignal[i] = this.thetaSignal[i] + t * this.step[i];
        }
        nextValue = this.groupNll(g, mu, nextTheta, this.trialSignal);
        if (nextValue <= value) break;
        t *= 0.5;
      }
      if (!(nextValue <= value)) break;
      let largestMove = Math.abs(nextTheta - thetaGroup);
      for (let k = start; k < end; k++) {
        const i = m.groupRegions[k];
        largestMove = Math.max(largestMove, Math.abs(this.trialSignal[i] - this.thetaSignal[i]));
        this.thetaSignal[i] = this.trialSignal[i];
      }
      thetaGroup = nextTheta;
      value = nextValue;
      if (largestMove < 1e-12) break;
    }
    this.theta[g] = thetaGroup;
    return value;
  }

  /**
   * Fills the per-region gradient, curvature and cross terms of the group's
   * -ln L with respect to the signal nuisances, stores the group-parameter
   * curvature, and returns the derivative with respect to theta_g.
   */
  private derivatives(g: number, mu: number, thetaGroup: number): number {
    const m = this.model;
    let g0 = thetaGroup;
    let h00 = 1;
    for (let k = m.groupStart[g]; k < m.groupStart[g + 1]; k++) {
      const i = m.groupRegions[k];
      const n = this.data[i];
      const ts = this.thetaSignal[i];
      const ls = m.lnSignalFactor[i];
      const signal = mu * m.signal[i] * Math.exp(ls * ts);
      const background = m.backgroundOf(i, thetaGroup);
      const lambda = signal + background;
      // d(-ln L)/d lambda and d^2(-ln L)/d lambda^2.
      const residual = n > 0 ? 1 - n / lambda : 1;
      const weight = n > 0 ? n / (lambda * lambda) : 0;
      let dB = 0;
      let d2B = 0;
      if (m.kind[i] === LOG_NORMAL_BACKGROUND) {
        dB = m.lnKappa[i] * background;
        d2B = m.lnKappa[i] * dB;
      } else if (m.kind[i] === GAUSSIAN_BACKGROUND) {
        dB = m.backgroundUncertainty[i];
      }
      g0 += residual * dB;
      h00 += weight * dB * dB + residual * d2B;
      const dS = ls * signal;
      this.gradient[i] = residual * dS + ts;
      this.curvature[i] = weight * dS * dS + residual * ls * dS + 1;
      this.cross[i] = weight * dB * dS;
    }
    this.groupCurvature = h00;
    return g0;
  }

  /**
   * Solves the arrowhead Newton system H d = -gradient for the group,
   * adding a multiple of the identity until H is positive definite
   * (Levenberg damping); writes the signal-nuisance steps into `step` and
   * returns the step of theta_g.
   */
  private newtonStep(g: number, gradientGroup: number, frozen: boolean, hasSignalNuisance: boolean): number {
    const m = this.model;
    const start = m.groupStart[g];
    const end = m.groupStart[g + 1];
    const h00 = this.groupCurvature;
    let damping = 0;
    for (let attempt = 0; attempt < 200; attempt++) {
      let schur = h00 + damping;
      let rhs = -gradientGroup;
      let positive = true;
      for (let k = start; k < end; k++) {
        const i = m.groupRegions[k];
        const diagonal = this.curvature[i] + damping;
        if (!(diagonal > 0)) positive = false;
        if (!frozen && hasSignalNuisance) {
          schur -= this.cross[i] ** 2 / diagonal;
          rhs += (this.cross[i] * this.gradient[i]) / diagonal;
        }
      }
      if (positive && (frozen || schur > 0)) {
        const d0 = frozen ? 0 : rhs / schur;
        for (let k = start; k < end; k++) {
          const i = m.groupRegions[k];
          this.step[i] = hasSignalNuisance ? (-this.gradient[i] - this.cross[i] * d0) / (this.curvature[i] + damping) : 0;
        }
        return d0;
      }
      damping = damping === 0 ? 1e-6 * (1 + Math.abs(h00)) : damping * 4;
    }
    throw new TamisError('numeric', 'profile fit: no positive-definite Newton system');
  }
}
