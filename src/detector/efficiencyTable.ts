/**
 * A probability tabulated in bins of transverse momentum and |pseudorapidity|
 * (identification efficiencies, tagging and fake rates), looked up on flat
 * typed arrays so the detector's hot loop allocates nothing.
 *
 * Bin convention (tamis's own, documented in DEVELOPERS.md "Detector profiles"):
 * bins are half-open [low, high). Below the first pT edge or outside the
 * |eta| edges the probability is 0 (the object is outside the acceptance of
 * this measurement); above the last pT edge the last pT bin applies (the
 * efficiency plateau continues).
 */
export class EfficiencyTable {
  /** pT bin edges, GeV, strictly increasing. */
  readonly ptEdges: Float64Array;
  /** |eta| bin edges, strictly increasing, >= 0. */
  readonly absEtaEdges: Float64Array;
  /** Probabilities, row-major: `values[ptBin * etaBins + etaBin]`. */
  readonly values: Float64Array;
  readonly ptBins: number;
  readonly etaBins: number;
  private readonly ptLow: number;
  private readonly etaLow: number;
  private readonly etaHigh: number;

  /**
   * @param ptEdges pT edges in GeV (n + 1 numbers for n bins)
   * @param absEtaEdges |eta| edges (m + 1 numbers for m bins)
   * @param rows n rows of m probabilities, one row per pT bin
   * @throws RangeError when the shapes do not match (the profile loader checks shapes first and reports them with file and line)
   * @example
   * new EfficiencyTable([10, 20], [0, 2.5], [[0.8]]).probability(15, 1) // 0.8
   */
  constructor(ptEdges: readonly number[], absEtaEdges: readonly number[], rows: readonly (readonly number[])[]) {
    this.ptBins = ptEdges.length - 1;
    this.etaBins = absEtaEdges.length - 1;
    if (this.ptBins < 1 || this.etaBins < 1 || rows.length !== this.ptBins || rows.some((r) => r.length !== this.etaBins)) {
      throw new RangeError(`efficiency table needs ${this.ptBins} rows x ${this.etaBins} columns`);
    }
    this.ptEdges = Float64Array.from(ptEdges);
    this.absEtaEdges = Float64Array.from(absEtaEdges);
    this.values = new Float64Array(this.ptBins * this.etaBins);
    for (let i = 0; i < this.ptBins; i++) for (let j = 0; j < this.etaBins; j++) this.values[i * this.etaBins + j] = rows[i]![j]!;
    this.ptLow = this.ptEdges[0]!;
    this.etaLow = this.absEtaEdges[0]!;
    this.etaHigh = this.absEtaEdges[this.etaBins]!;
  }

  /** Probability for an object of transverse momentum `pt` (GeV) at pseudorapidity magnitude `absEta`. */
  probability(pt: number, absEta: number): number {
    if (!(pt >= this.ptLow) || !(absEta >= this.etaLow) || !(absEta < this.etaHigh)) return 0;
    let i = this.ptBins - 1;
    while (pt < this.ptEdges[i]!) i--;
    let j = 0;
    while (absEta >= this.absEtaEdges[j + 1]!) j++;
    return this.values[i * this.etaBins + j]!;
  }

  /** Largest |eta| with a non-zero acceptance (the last |eta| edge). */
  get absEtaMax(): number {
    return this.etaHigh;
  }
}
