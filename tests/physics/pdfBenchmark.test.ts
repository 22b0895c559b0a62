import { describe, expect, it } from 'vitest';
import { lesHouchesXfDirect } from '../../src/physics/pdf/lesHouchesEvolution.js';
import { lesHouchesToyDensities } from '../../src/physics/pdf/lesHouchesGrid.js';
import { expectClose } from '../helpers.js';

/**
 * Les Houches LO evolution benchmark, variable flavour number, mu_F^2 = mu_R^2 = 10^4 GeV^2:
 * W. Giele et al., hep-ph/0204316, section 1.3, Table 2, as copied in ../shared/checks.md
 * section 1 ([S]; an independent Mellin evolution reproduces it within rounding, [C]).
 * Columns: x, x u_v, x d_v, x L-, x L+, x s+, x c+, x b+, x g.
 */
const TABLE_2: readonly (readonly number[])[] = [
  [1e-7, 5.8771e-5, 3.4963e-5, 7.8233e-7, 1.0181e2, 4.9815e1, 4.9088e1, 4.607e1, 1.3272e3],
  [1e-6, 3.3933e-4, 2.0129e-4, 5.1142e-6, 5.1182e1, 2.4725e1, 2.4148e1, 2.2239e1, 6.0117e2],
  [1e-5, 1.9006e-3, 1.1229e-3, 3.2249e-5, 2.4693e1, 1.1659e1, 1.1201e1, 1.0037e1, 2.5282e2],
  [1e-4, 1.0186e-2, 5.9819e-3, 1.9345e-4, 1.1406e1, 5.1583, 4.7953, 4.1222, 9.6048e1],
  [1e-3, 5.0893e-2, 2.9576e-2, 1.073e-3, 5.0424, 2.0973, 1.8147, 1.4582, 3.1333e1],
  [1e-2, 2.208e-1, 1.2497e-1, 4.9985e-3, 2.0381, 7.2625e-1, 5.3107e-1, 3.8106e-1, 7.7728],
  [0.1, 5.7166e-1, 2.8334e-1, 1.0428e-2, 4.0496e-1, 1.1596e-1, 5.8288e-2, 3.5056e-2, 8.4358e-1],
  [0.3, 3.7597e-1, 1.4044e-1, 3.2629e-3, 3.9592e-2, 1.0363e-2, 4.074e-3, 2.2039e-3, 7.8026e-2],
  [0.5, 1.3284e-1, 3.4802e-2, 4.2031e-4, 2.8066e-3, 7.1707e-4, 2.5958e-4, 1.3522e-4, 7.4719e-3],
  [0.7, 2.2643e-2, 3.5134e-3, 1.5468e-5, 6.7201e-5, 1.7278e-5, 6.3958e-6, 3.3996e-6, 3.5241e-4],
  [0.9, 4.2047e-4, 2.1529e-5, 1.0635e-8, 3.4998e-8, 9.8394e-9, 4.733e-9, 2.8903e-9, 1.0307e-6],
];
const NAMES = ['x u_v', 'x d_v', 'x L-', 'x L+', 'x s+', 'x c+', 'x b+', 'x g'];

/** The benchmark's combinations from the 11 columns g d u s c b dbar ubar sbar cbar bbar. */
function benchmarkColumns(v: ArrayLike<number>): number[] {
  return [v[2]! - v[7]!, v[1]! - v[6]!, v[6]! - v[7]!, 2 * (v[6]! + v[7]!), v[3]! + v[8]!, v[4]! + v[9]!, v[5]! + v[10]!, v[0]!];
}

/** 0.1% for x <= 0.7 and 1% above, the tolerance the issue sets. */
const tolerance = (x: number): number => (x <= 0.7 ? 1e-3 : 1e-2);

describe('LO toy densities against the Les Houches benchmark table (hep-ph/0204316, Table 2)', () => {
  it('direct Mellin evolution reproduces every entry at Q^2 = 10^4 GeV^2 (within the table rounding, 1e-4)', () => {
    const direct = lesHouchesXfDirect(TABLE_2.map((row) => row[0]!), [100]);
    TABLE_2.forEach((row, ix) => {
      const ours = benchmarkColumns(direct.map((column) => column[ix]!));
      // The table has five significant digits: half a unit in the last place is up to 5e-5 relative.
      ours.forEach((value, k) => expectClose(value, row[k + 1]!, { rel: Math.min(tolerance(row[0]!), 1e-4) }, `${NAMES[k]} at x = ${row[0]}`));
    });
  });

  it('the interpolated grid reproduces every entry (0.1% for x <= 0.7, 1% at x = 0.9)', () => {
    const grid = lesHouchesToyDensities();
    const out = new Float64Array(11);
    for (const row of TABLE_2) {
      grid.xfxColumns(row[0]!, 100, out);
      benchmarkColumns(out).forEach((value, k) => expectClose(value, row[k + 1]!, { rel: tolerance(row[0]!) }, `${NAMES[k]} at x = ${row[0]}`));
    }
    // The grid starts at x = 1e-7, so the table's first row is inside it, not extrapolated.
    expect(grid.xMin).toBeLessThanOrEqual(1e-7);
  });
});
