/**
 * Tables of x f(x, Q) for people and scripts: the data behind `tamis pdf`,
 * as plain objects (the JSON layout scripts rely on) and as aligned text.
 */
import type { PartonDensity } from '../partonDensity.js';
import { FLAVOUR_KEYS, type FlavourKey, COLUMN_PDG_IDS } from './flavours.js';

/** One (x, Q) point: the keys are part of the `tamis pdf --json` interface. */
export interface DensityTableRow {
  x: number;
  /** Scale in GeV. */
  q: number;
  alpha_s: number;
  /** x f(x, Q) per parton. */
  xf: Record<FlavourKey, number>;
}

/**
 * x f(x, Q) of every parton at every (x, q), q-major then x in the order given.
 * @example
 * densityTable(lesHouchesToyDensities(), [0.1], [100])[0].xf.g // 0.84358 (Table 2 of hep-ph/0204316)
 */
export function densityTable(density: PartonDensity, xs: readonly number[], qs: readonly number[]): DensityTableRow[] {
  const rows: DensityTableRow[] = [];
  for (const q of qs) {
    const alphaS = density.alphaS(q);
    for (const x of xs) {
      const xf = {} as Record<FlavourKey, number>;
      FLAVOUR_KEYS.forEach((key, c) => {
        xf[key] = density.xfx(COLUMN_PDG_IDS[c]!, x, q);
      });
      rows.push({ x, q, alpha_s: alphaS, xf });
    }
  }
  return rows;
}

const WIDTH = 11;

/** Aligned text: per scale a header line (densities, Q, alpha_s), then one row per x, 5 significant figures. */
export function formatDensityTable(rows: readonly DensityTableRow[], name: string): string {
  const cell = (text: string): string => text.padStart(WIDTH);
  const lines: string[] = [];
  let currentQ: number | undefined;
  for (const row of rows) {
    if (row.q !== currentQ) {
      if (currentQ !== undefined) lines.push('');
      currentQ = row.q;
      lines.push(`x f(x, Q) of ${name}`);
      lines.push(`Q = ${row.q} GeV, alpha_s(Q) = ${row.alpha_s.toPrecision(5)}`);
      lines.push(['x', ...FLAVOUR_KEYS].map(cell).join(' '));
    }
    lines.push([row.x, ...FLAVOUR_KEYS.map((key) => row.xf[key])].map((v) => cell(v.toExponential(4))).join(' '));
  }
  return `${lines.join('\n')}\n`;
}
