/**
 * CSV text with fixed number formatting, so the same results give the same
 * bytes (reproducibility tests compare files). Quoting follows RFC 4180 via
 * fast-csv.
 */
import { writeToString } from 'fast-csv';

export type CsvCell = string | number | boolean | null | undefined;

/** Formats a number for CSV: integers as is, others with 6 significant digits; NaN/undefined -> empty. */
export function csvNumber(value: number | null | undefined, significantDigits = 6): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '';
  if (!Number.isFinite(value)) return value > 0 ? 'inf' : '-inf';
  if (Number.isInteger(value) && Math.abs(value) < 1e15) return String(value);
  return value.toPrecision(significantDigits).replace(/\.?0+e/, 'e').replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
}

/** CSV text with a header row; numbers are formatted with `csvNumber`. Ends with a newline. */
export async function csvText(header: readonly string[], rows: readonly (readonly CsvCell[])[]): Promise<string> {
  const formatted = rows.map((row) => row.map((cell) => (typeof cell === 'number' ? csvNumber(cell) : cell === null || cell === undefined ? '' : String(cell))));
  const text = await writeToString([header as string[], ...formatted], { headers: false, includeEndRowDelimiter: true });
  return text;
}
