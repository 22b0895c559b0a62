/**
 * Aligned plain-text tables for the terminal: left-aligned text columns,
 * right-aligned numeric columns, one header rule.
 */

export interface TableColumn {
  header: string;
  /** Right-align (numbers). Default: left. */
  alignRight?: boolean;
}

/**
 * Formats rows of cells as an aligned table.
 *
 * @example
 * formatTable([{ header: 'a' }, { header: 'b', alignRight: true }], [['x', '1.5'], ['yy', '10']])
 * // 'a       b\n--  ----\nx     1.5\nyy     10'
 */
export function formatTable(columns: readonly TableColumn[], rows: readonly (readonly string[])[]): string {
  const widths = columns.map((c, j) => Math.max(c.header.length, ...rows.map((r) => (r[j] ?? '').length)));
  const pad = (text: string, j: number): string => (columns[j]!.alignRight ? text.padStart(widths[j]!) : text.padEnd(widths[j]!));
  const lines = [
    columns.map((c, j) => pad(c.header, j)).join('  ').trimEnd(),
    widths.map((w) => '-'.repeat(w)).join('  '),
    ...rows.map((r) => columns.map((_, j) => pad(r[j] ?? '', j)).join('  ').trimEnd()),
  ];
  return lines.join('\n');
}

/**
 * A number in a short, readable form: 4 significant digits, exponent form for
 * very large or small magnitudes, "-" for NaN, "inf" for infinities.
 *
 * @example
 * formatNumber(0.000123456) // '1.235e-4'
 */
export function formatNumber(value: number, digits = 4): string {
  if (Number.isNaN(value)) return '-';
  if (!Number.isFinite(value)) return value > 0 ? 'inf' : '-inf';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e5 || magnitude < 1e-3) {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    return `${mantissa}e${Number(exponent)}`;
  }
  return String(Number(value.toPrecision(digits)));
}
