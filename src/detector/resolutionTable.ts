/**
 * Relative resolution of a measured quantity X (energy in a calorimeter, or
 * transverse momentum in a tracker) in bins of |pseudorapidity|:
 *
 *   sigma_X / X = sqrt( (noise / X)^2 + stochastic^2 / X + constant^2 + (linear X)^2 )
 *
 * with X in GeV. The first three terms are the usual calorimeter form
 * a/sqrt(E) (+) b/E (+) c added in quadrature (PDG Review of Particle Physics,
 * "Particle detectors at accelerators", calorimetry section; from memory); the
 * last is the curvature term of a tracker, sigma_pT/pT growing linearly with pT
 * (same review, tracking section; from memory). Beyond the last |eta| edge the
 * last bin applies.
 */
export class ResolutionTable {
  readonly absEtaEdges: Float64Array;
  /** Per bin: noise term, GeV. */
  readonly noise: Float64Array;
  /** Per bin: stochastic term, GeV^(1/2) (1.0 means 100%/sqrt(E)). */
  readonly stochastic: Float64Array;
  /** Per bin: constant term (dimensionless, 0.05 means 5%). */
  readonly constant: Float64Array;
  /** Per bin: linear term, 1/GeV (1e-4 means 10% at 1 TeV). */
  readonly linear: Float64Array;
  readonly bins: number;
  /** Squares of the terms, precomputed for the hot loop. */
  private readonly noise2: Float64Array;
  private readonly stochastic2: Float64Array;
  private readonly constant2: Float64Array;
  private readonly linear2: Float64Array;

  /**
   * @throws RangeError when a term does not have one value per |eta| bin (the profile loader reports this with file and line first)
   * @example
   * new ResolutionTable([0, 5], { noise: [0], stochastic: [1], constant: [0], linear: [0] }).relativeWidth(100, 0) // 0.1
   */
  constructor(absEtaEdges: readonly number[], terms: { noise: readonly number[]; stochastic: readonly number[]; constant: readonly number[]; linear: readonly number[] }) {
    this.bins = absEtaEdges.length - 1;
    for (const [name, values] of Object.entries(terms)) {
      if (values.length !== this.bins) throw new RangeError(`resolution term ${name} needs ${this.bins} values, got ${values.length}`);
    }
    this.absEtaEdges = Float64Array.from(absEtaEdges);
    this.noise = Float64Array.from(terms.noise);
    this.stochastic = Float64Array.from(terms.stochastic);
    this.constant = Float64Array.from(terms.constant);
    this.linear = Float64Array.from(terms.linear);
    this.noise2 = this.noise.map((v) => v * v);
    this.stochastic2 = this.stochastic.map((v) => v * v);
    this.constant2 = this.constant.map((v) => v * v);
    this.linear2 = this.linear.map((v) => v * v);
  }

  /** Relative width sigma_X / X for a measured value `x` > 0 (GeV) at |eta| = `absEta`. */
  relativeWidth(x: number, absEta: number): number {
    let j = 0;
    while (j < this.bins - 1 && absEta >= this.absEtaEdges[j + 1]!) j++;
    const inverse = 1 / x;
    return Math.sqrt(this.noise2[j]! * inverse * inverse + this.stochastic2[j]! * inverse + this.constant2[j]! + this.linear2[j]! * x * x);
  }
}
