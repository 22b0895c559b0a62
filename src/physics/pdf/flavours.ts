/**
 * Parton labels shared by the grids, the CSV layout, the CLI and its JSON keys.
 * The column order g d u s c b dbar ubar sbar cbar bbar is the one users see.
 */
import { TamisError } from '../../errors.js';

/** Column keys in display order; `FLAVOUR_KEYS[i]` is column i of every grid. */
export const FLAVOUR_KEYS = ['g', 'd', 'u', 's', 'c', 'b', 'dbar', 'ubar', 'sbar', 'cbar', 'bbar'] as const;
export type FlavourKey = (typeof FLAVOUR_KEYS)[number];

/** Number of grid columns (gluon, five quarks, five antiquarks). */
export const COLUMN_COUNT = FLAVOUR_KEYS.length;

/** PDG id of each column (gluon as 21). */
export const COLUMN_PDG_IDS: readonly number[] = [21, 1, 2, 3, 4, 5, -1, -2, -3, -4, -5];

/**
 * Column of a PDG flavour id, or -1 for a flavour with no density (top).
 * Index table for ids -6..6 (0 = gluon).
 */
const COLUMN_OF_ID = Int8Array.from([-1, 10, 9, 8, 7, 6, 0, 1, 2, 3, 4, 5, -1]);

/**
 * Grid column of a PDG flavour: 1 d, 2 u, 3 s, 4 c, 5 b, negative for
 * antiquarks, 21 or 0 for the gluon; -1 for the top (density zero).
 * @throws TamisError('bad_input') for any other id.
 */
export function columnOfFlavour(flavour: number): number {
  if (flavour === 21) return 0;
  if (Number.isInteger(flavour) && flavour >= -6 && flavour <= 6) return COLUMN_OF_ID[flavour + 6]!;
  throw new TamisError('bad_input', `unknown parton flavour ${flavour}`, {
    suggestion: 'use PDG ids: 1 d, 2 u, 3 s, 4 c, 5 b, 6 t, negative for antiquarks, 21 (or 0) for the gluon',
  });
}

/** Slot of column i in the `xfxAll` output array (`out[flavour + 6]`). */
export const OUTPUT_SLOT_OF_COLUMN: readonly number[] = [6, 7, 8, 9, 10, 11, 5, 4, 3, 2, 1];
