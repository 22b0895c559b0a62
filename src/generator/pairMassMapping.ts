/**
 * Maps one uniform number to the squared pair mass s (partonic CM energy
 * squared) with a density that follows the integrand's peaks, so the VEGAS
 * grid starts close to the answer and event weights stay bounded.
 *
 * The density is a mixture (the multi-channel method of R. Kleiss and
 * R. Pittau, Comput. Phys. Commun. 83 (1994) 141 — reference from memory): a power law p ~ 1/s for
 * the falling continuum over the whole range, plus one Breit–Wigner
 * p ~ 1/((s - M^2)^2 + M^2 Gamma^2) per massive s-channel vector whose pole lies
 * inside the range, restricted to |s - M^2| < WINDOW M Gamma. The unit
 * interval is split among the components in proportion to their mixture
 * weights; a point drawn from any component gets the Jacobian 1/p_mix(s) of the
 * whole mixture, which keeps the estimate unbiased.
 *
 * The window keeps the far tails of a narrow peak with the continuum: an
 * unrestricted Breit–Wigner squeezes everything far below the pole into a
 * sliver of the unit interval that a VEGAS bin cannot resolve, which produced
 * rare weights 20 times the mean (measured on the demo benchmark).
 */
import type { MediatorCouplings } from './model/types.js';

/** Share of the points given to the 1/s continuum when resonances are present. */
const CONTINUUM_SHARE = 0.5;
/** Half-width of a Breit–Wigner component, in units of M Gamma in s. */
const WINDOW = 30;

export class PairMassMapping {
  readonly sMin: number;
  readonly sMax: number;
  /** Number of Breit–Wigner components. */
  readonly resonanceCount: number;
  /** Share of the unit interval given to the 1/s continuum; each Breit–Wigner component gets `resonanceShare` after it. */
  readonly continuumShare: number;
  readonly resonanceShare: number;
  private readonly logRange: number;
  private readonly poleMass2: Float64Array;
  private readonly massWidth: Float64Array;
  private readonly rhoMin: Float64Array;
  private readonly rhoRange: Float64Array;
  private readonly windowLow: Float64Array;
  private readonly windowHigh: Float64Array;

  /**
   * @param sMin, sMax range of s in GeV^2 (0 < sMin < sMax)
   * @param mediators the s-channel vectors; each massive one with its pole inside the range adds a component
   */
  constructor(sMin: number, sMax: number, mediators: readonly MediatorCouplings[]) {
    this.sMin = sMin;
    this.sMax = sMax;
    this.logRange = Math.log(sMax / sMin);
    const poles = mediators.filter((v) => v.mass > 0 && v.width > 0 && v.mass * v.mass > sMin && v.mass * v.mass < sMax);
    this.resonanceCount = poles.length;
    this.continuumShare = poles.length > 0 ? CONTINUUM_SHARE : 1;
    this.resonanceShare = poles.length > 0 ? (1 - CONTINUUM_SHARE) / poles.length : 0;
    this.poleMass2 = new Float64Array(poles.length);
    this.massWidth = new Float64Array(poles.length);
    this.rhoMin = new Float64Array(poles.length);
    this.rhoRange = new Float64Array(poles.length);
    this.windowLow = new Float64Array(poles.length);
    this.windowHigh = new Float64Array(poles.length);
    poles.forEach((v, i) => {
      const m2 = v.mass * v.mass;
      const mg = v.mass * v.width;
      const low = Math.max(sMin, m2 - WINDOW * mg);
      const high = Math.min(sMax, m2 + WINDOW * mg);
      this.poleMass2[i] = m2;
      this.massWidth[i] = mg;
      this.windowLow[i] = low;
      this.windowHigh[i] = high;
      this.rhoMin[i] = Math.atan((low - m2) / mg);
      this.rhoRange[i] = Math.atan((high - m2) / mg) - this.rhoMin[i]!;
    });
  }

  /** s (GeV^2) for a uniform u in [0, 1). */
  sample(u: number): number {
    if (u < this.continuumShare) {
      const s = this.sMin * Math.exp(this.logRange * (u / this.continuumShare));
      return s < this.sMax ? s : this.sMax;
    }
    let k = Math.floor((u - this.continuumShare) / this.resonanceShare);
    if (k >= this.resonanceCount) k = this.resonanceCount - 1;
    const v = (u - this.continuumShare - k * this.resonanceShare) / this.resonanceShare;
    const s = this.poleMass2[k]! + this.massWidth[k]! * Math.tan(this.rhoMin[k]! + v * this.rhoRange[k]!);
    const low = this.windowLow[k]!;
    const high = this.windowHigh[k]!;
    return s < low ? low : s > high ? high : s;
  }

  /**
   * Sorted points of the unit interval where the integrand, as a function of
   * u, jumps or changes fast: component boundaries, and inside the continuum
   * component the images of each window's edges and of M^2 + k M Gamma for
   * k = 0, +-1, +-3, +-10. For deterministic quadratures that must split their panels there.
   */
  breakpoints(): number[] {
    const points = new Set<number>([0, 1]);
    const inContinuum = (s: number): void => {
      if (s > this.sMin && s < this.sMax) points.add((this.continuumShare * Math.log(s / this.sMin)) / this.logRange);
    };
    for (let k = 0; k < this.resonanceCount; k++) {
      points.add(this.continuumShare + k * this.resonanceShare);
      inContinuum(this.windowLow[k]!);
      inContinuum(this.windowHigh[k]!);
      for (const m of [0, 1, -1, 3, -3, 10, -10]) inContinuum(this.poleMass2[k]! + m * this.massWidth[k]!);
    }
    return [...points].sort((a, b) => a - b);
  }

  /** The mixture density p(s) in GeV^-2 (integrates to 1 over [sMin, sMax]). */
  density(s: number): number {
    let p = this.continuumShare / (s * this.logRange);
    for (let k = 0; k < this.resonanceCount; k++) {
      if (s < this.windowLow[k]! || s > this.windowHigh[k]!) continue;
      const d = s - this.poleMass2[k]!;
      const mg = this.massWidth[k]!;
      p += (this.resonanceShare * mg) / ((d * d + mg * mg) * this.rhoRange[k]!);
    }
    return p;
  }
}
