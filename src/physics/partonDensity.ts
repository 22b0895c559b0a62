/**
 * The interface every set of parton densities implements (the built-in
 * evolved Les Houches toy densities, or a user-supplied CSV grid).
 *
 * Flavour numbering follows the PDG scheme: 1 d, 2 u, 3 s, 4 c, 5 b, 6 t,
 * negative for antiquarks, 21 (or 0) for the gluon.
 */
export interface PartonDensity {
  /** Short description for reports, e.g. "LO toy densities (Les Houches 2001 benchmark input)". */
  readonly name: string;
  /** x f(x, Q) for one flavour at momentum fraction x and factorisation scale Q (GeV). Zero for x >= 1; below xMin the built-in grids continue as a power law; Q outside [qMin, qMax] is clamped. */
  xfx(flavour: number, x: number, q: number): number;
  /**
   * x f(x, Q) for all flavours at once, written to `out[flavour + 6]` for
   * flavour = -6..6 (index 6 is the gluon). The fast path for cross sections.
   */
  xfxAll(x: number, q: number, out: Float64Array): void;
  /** The strong coupling that goes with these densities, at scale Q (GeV). */
  alphaS(q: number): number;
  /** Range of validity of the grid. */
  readonly xMin: number;
  readonly qMin: number;
  readonly qMax: number;
}
