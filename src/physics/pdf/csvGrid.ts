/**
 * Parton-density grids as CSV files (tamis's own layout).
 *
 * Layout:
 *
 *   # optional comment lines start with '#'; blank lines are ignored
 *   x,q,g,d,u,s,c,b,dbar,ubar,sbar,cbar,bbar
 *   1e-07,1.4,8.51e+00,...
 *
 * - The first line that is not a comment is the header. It names the columns
 *   x (momentum fraction), q (scale in GeV) and one column per parton, named like
 *   the JSON keys of `tamis pdf --json`: g d u s c b dbar ubar sbar cbar bbar.
 *   Columns may come in any order; every one is required, no other is allowed.
 * - Each data line gives x f(x, Q) of every parton at one (x, q): numbers,
 *   finite and >= 0, with 0 < x < 1 (every density vanishes at x = 1) and q > 0.
 * - The points form a full rectangle: every distinct x at every distinct q,
 *   exactly once. Lines may come in any order (tamis writes q-major, x ascending).
 * - At least 4 distinct x values (cubic interpolation) and 1 q value.
 * A heavy quark that is zero at every x for the lowest q values and positive
 * above is treated as switching on at the last zero row (a flavour threshold).
 *
 * The file is split by hand rather than with a CSV library: a numeric grid needs
 * no quoting, and the split keeps the exact line and column of every value, which
 * each error message names.
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { TamisError } from '../../errors.js';
import { writeFileAtomic } from '../../io/atomicWrite.js';
import { mzNormalisedAlphaS } from '../alphaS.js';
import { type DensityGridData, InterpolatedDensityGrid } from './densityGrid.js';
import { COLUMN_COUNT, FLAVOUR_KEYS } from './flavours.js';

const REQUIRED = ['x', 'q', ...FLAVOUR_KEYS] as const;
const MIN_X_VALUES = 4;

/** Options of `readDensityGridCsv`. */
export interface CsvGridOptions {
  /** The strong coupling that goes with the densities (GeV -> alpha_s). @default mzNormalisedAlphaS */
  alphaS?: (q: number) => number;
  /** Name shown in tables. @default "CSV grid <file name>" */
  name?: string;
}

interface Field {
  text: string;
  column: number;
}

/** Splits one line at commas, keeping the 1-based character column where each field starts. */
function splitLine(line: string): Field[] {
  const fields: Field[] = [];
  let start = 0;
  for (;;) {
    const comma = line.indexOf(',', start);
    const end = comma < 0 ? line.length : comma;
    const raw = line.slice(start, end);
    const lead = raw.length - raw.trimStart().length;
    fields.push({ text: raw.trim(), column: start + lead + 1 });
    if (comma < 0) return fields;
    start = comma + 1;
  }
}

/** Parses CSV text in the layout above; `file` is used in error messages. */
export function parseDensityGridCsv(text: string, file: string): DensityGridData {
  const fail = (message: string, line?: number, column?: number, key?: string, suggestion?: string): never => {
    throw new TamisError('schema', message, { file, line, column, key, suggestion });
  };
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  let headerLine = -1;
  let columnOf = new Map<string, number>();
  const rows: { line: number; x: number; q: number; values: Float64Array }[] = [];
  for (let i = 0; i < lines.length; i++) {
    const content = lines[i]!.trim();
    if (content === '' || content.startsWith('#')) continue;
    const fields = splitLine(lines[i]!);
    if (headerLine < 0) {
      headerLine = i + 1;
      columnOf = new Map();
      fields.forEach((field, k) => {
        if (!(REQUIRED as readonly string[]).includes(field.text)) {
          fail(`unknown column "${field.text}"`, i + 1, field.column, field.text, `the columns are ${REQUIRED.join(', ')}`);
        }
        if (columnOf.has(field.text)) fail(`column "${field.text}" appears twice`, i + 1, field.column, field.text);
        columnOf.set(field.text, k);
      });
      for (const name of REQUIRED) {
        if (!columnOf.has(name)) fail(`missing column "${name}"`, i + 1, undefined, name, `the header must name ${REQUIRED.join(', ')}`);
      }
      continue;
    }
    if (fields.length !== columnOf.size) fail(`expected ${columnOf.size} values, found ${fields.length}`, i + 1);
    const number = (name: string): number => {
      const field = fields[columnOf.get(name)!]!;
      const value = field.text === '' ? Number.NaN : Number(field.text);
      if (Number.isNaN(value)) fail(`not a number: "${field.text}"`, i + 1, field.column, name);
      if (!Number.isFinite(value)) fail(`value must be finite, got ${field.text}`, i + 1, field.column, name);
      return value;
    };
    const x = number('x');
    if (!(x > 0 && x < 1)) fail(`x must be in (0, 1), got ${x}`, i + 1, fields[columnOf.get('x')!]!.column, 'x');
    const q = number('q');
    if (!(q > 0)) fail(`q must be > 0 GeV, got ${q}`, i + 1, fields[columnOf.get('q')!]!.column, 'q');
    const values = new Float64Array(COLUMN_COUNT);
    FLAVOUR_KEYS.forEach((key, c) => {
      const v = number(key);
      if (v < 0) fail(`x f must be >= 0, got ${v}`, i + 1, fields[columnOf.get(key)!]!.column, key);
      values[c] = v;
    });
    rows.push({ line: i + 1, x, q, values });
  }
  if (headerLine < 0) fail('no header line: the file is empty or only has comments', undefined, undefined, undefined, `start with the header ${REQUIRED.join(',')}`);

  const xs = Float64Array.from(new Set(rows.map((r) => r.x))).sort();
  const qs = Float64Array.from(new Set(rows.map((r) => r.q))).sort();
  if (xs.length < MIN_X_VALUES) {
    fail(`too few points: ${xs.length} distinct x value(s), at least ${MIN_X_VALUES} are needed`, rows.length > 0 ? rows[rows.length - 1]!.line : headerLine);
  }
  const xIndex = new Map(Array.from(xs, (x, i) => [x, i]));
  const qIndex = new Map(Array.from(qs, (q, i) => [q, i]));
  const lineAt = new Int32Array(xs.length * qs.length);
  const values = Array.from({ length: COLUMN_COUNT }, () => new Float64Array(xs.length * qs.length));
  for (const row of rows) {
    const at = qIndex.get(row.q)! * xs.length + xIndex.get(row.x)!;
    if (lineAt[at] !== 0) fail(`the point x = ${row.x}, q = ${row.q} was already given on line ${lineAt[at]}`, row.line);
    lineAt[at] = row.line;
    for (let c = 0; c < COLUMN_COUNT; c++) values[c]![at] = row.values[c]!;
  }
  const missing = lineAt.indexOf(0);
  if (missing >= 0) {
    const count = lineAt.filter((l) => l === 0).length;
    fail(
      `the grid is not rectangular: ${count} (x, q) point(s) missing, the first x = ${xs[missing % xs.length]}, q = ${qs[Math.floor(missing / xs.length)]}`,
      undefined, undefined, undefined,
      `give every one of the ${xs.length} x values at every one of the ${qs.length} q values`,
    );
  }
  return { x: xs, q: qs, values, segmentStarts: [] };
}

/**
 * Reads a user-supplied grid (layout above) as a PartonDensity.
 * @throws TamisError('bad_file') if the file cannot be read, TamisError('schema') naming file, line, column and key for bad content.
 * @example
 * readDensityGridCsv('my-grid.csv').xfx(21, 0.01, 100)
 */
export function readDensityGridCsv(file: string, options: CsvGridOptions = {}): InterpolatedDensityGrid {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new TamisError('bad_file', `cannot read file: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`, { file });
  }
  const data = parseDensityGridCsv(text, file);
  const alphaS = options.alphaS ?? ((q: number) => mzNormalisedAlphaS.alphaS(q));
  return new InterpolatedDensityGrid(options.name ?? `CSV grid ${basename(file)}`, data, alphaS);
}

/** The grid in the CSV layout above, q-major and x ascending, 10 significant digits. */
export function formatDensityGridCsv(data: DensityGridData, name: string): string {
  const nx = data.x.length;
  const parts: string[] = [
    `# parton density grid written by tamis: ${name}\n`,
    '# columns: x, q in GeV, then x f(x, q) per parton; layout documented in tamis (physics/pdf/csvGrid.ts)\n',
    `${REQUIRED.join(',')}\n`,
  ];
  for (let iq = 0; iq < data.q.length; iq++) {
    for (let ix = 0; ix < nx; ix++) {
      const cells = [data.x[ix]!.toPrecision(17), data.q[iq]!.toPrecision(17)];
      for (let c = 0; c < COLUMN_COUNT; c++) cells.push(data.values[c]![iq * nx + ix]!.toExponential(9));
      parts.push(`${cells.join(',')}\n`);
    }
  }
  return parts.join('');
}

/** Writes a grid atomically in the CSV layout above. */
export function writeDensityGridCsv(file: string, grid: InterpolatedDensityGrid): void {
  writeFileAtomic(file, formatDensityGridCsv(grid.data, grid.name));
}
