/**
 * A quantity that depends on |pseudorapidity| only (charge-flip rates), in
 * half-open bins [low, high). The first edge is 0; beyond the last edge the
 * last bin applies, so every reconstructed object gets a value.
 */
export class EtaBinnedValues {
  readonly absEtaEdges: Float64Array;
  readonly values: Float64Array;
  readonly bins: number;

  /**
   * @param absEtaEdges m + 1 increasing |eta| edges starting at 0
   * @param values m values, one per bin
   * @throws RangeError when the shapes do not match (the profile loader reports shapes with file and line first)
   * @example
   * new EtaBinnedValues([0, 1.5, 2.5], [1e-4, 1e-2]).at(2) // 0.01
   */
  constructor(absEtaEdges: readonly number[], values: readonly number[]) {
    this.bins = absEtaEdges.length - 1;
    if (this.bins < 1 || values.length !== this.bins) throw new RangeError(`|eta| table needs ${this.bins} values, got ${values.length}`);
    this.absEtaEdges = Float64Array.from(absEtaEdges);
    this.values = Float64Array.from(values);
  }

  /** Index of the |eta| bin holding `absEta` (the last bin beyond the last edge). */
  binOf(absEta: number): number {
    let j = 0;
    while (j < this.bins - 1 && absEta >= this.absEtaEdges[j + 1]!) j++;
    return j;
  }

  /** The value in the bin of `absEta`. */
  at(absEta: number): number {
    return this.values[this.binOf(absEta)]!;
  }
}
