/**
 * Reading a table of counting regions from CSV (parsed with fast-csv).
 *
 * Layout: a header line, then one region per line. Required columns `name`,
 * `observed` (whole number), `background`, `uncertainty` (absolute background
 * uncertainty, events); optional `group` (regions sharing a group name have
 * fully correlated background uncertainties), `signal` (the model's expected
 * signal events in the region, which fixes the signal shape of the
 * combination; default 1 everywhere) and `signal_uncertainty` (relative).
 * Empty lines and lines starting with `#` are skipped; a field may not span
 * lines. Errors name the file, line and character column of the bad field.
 */
import { parseString } from 'fast-csv';
import { TamisError } from '../errors.js';
import { editDistance, readTextFile } from '../io/yamlFile.js';

export interface RegionRow {
  name: string;
  observed: number;
  background: number;
  backgroundUncertainty: number;
  signal: number;
  /** Relative; undefined when the column is absent or the cell empty. */
  signalUncertainty?: number;
  group?: string;
  /** Line of the file (from 1). */
  line: number;
}

const REQUIRED = ['name', 'observed', 'background', 'uncertainty'] as const;
const OPTIONAL = ['group', 'signal', 'signal_uncertainty'] as const;
const KNOWN: readonly string[] = [...REQUIRED, ...OPTIONAL];

/** The 1-based character column where field `index` starts in a CSV line (quotes respected). */
export function fieldColumn(line: string, index: number): number {
  let field = 0;
  let quoted = false;
  for (let c = 0; c < line.length; c++) {
    if (field === index) return c + 1;
    const ch = line[c];
    if (ch === '"') quoted = !quoted;
    else if (ch === ',' && !quoted) field++;
  }
  return field === index ? line.length + 1 : 1;
}

function parseRows(text: string, file: string): Promise<string[][]> {
  return new Promise((resolve, reject) => {
    const rows: string[][] = [];
    parseString<string[], string[]>(text, { headers: false, ignoreEmpty: false, trim: true })
      .on('error', (error: Error) => reject(new TamisError('bad_file', `not valid CSV: ${error.message}`, { file })))
      .on('data', (row: string[]) => rows.push(row))
      .on('end', () => resolve(rows));
  });
}

/**
 * Regions from CSV text (`file` is used in messages).
 *
 * @example
 * await parseRegionsCsv('name,observed,background,uncertainty\nSR1,3,2.1,0.6\n', 'sr.csv')
 * // [{ name: 'SR1', observed: 3, background: 2.1, backgroundUncertainty: 0.6, signal: 1, line: 2 }]
 */
export async function parseRegionsCsv(text: string, file: string): Promise<RegionRow[]> {
  const lines = text.split(/\r?\n/);
  const rows = await parseRows(text, file);
  let header: string[] | undefined;
  const regions: RegionRow[] = [];
  const names = new Set<string>();
  for (let r = 0; r < rows.length; r++) {
    const cells = rows[r];
    const lineNumber = r + 1;
    if (cells.some((cell) => cell.includes('\n'))) throw new TamisError('bad_file', 'a field may not span lines', { file, line: lineNumber });
    if (cells.every((cell) => cell === '') || cells[0].startsWith('#')) continue;
    const raw = lines[r] ?? '';
    const where = (index: number, key: string) => ({ file, line: lineNumber, column: fieldColumn(raw, index), key });
    if (header === undefined) {
      header = cells.map((cell) => cell.toLowerCase());
      header.forEach((column, index) => {
        if (KNOWN.includes(column)) return;
        const near = KNOWN.find((known) => editDistance(known, column) <= 2);
        throw new TamisError('schema', `unknown column "${column}"`, {
          ...where(index, column),
          suggestion: near !== undefined ? `did you mean "${near}"?` : `columns are ${KNOWN.join(', ')}`,
        });
      });
      for (const column of REQUIRED) {
        if (!header.includes(column)) throw new TamisError('schema', `missing column "${column}"`, { file, line: lineNumber, suggestion: `required columns are ${REQUIRED.join(', ')}` });
      }
      continue;
    }
    const columns = header;
    if (cells.length !== columns.length) {
      throw new TamisError('schema', `expected ${columns.length} fields, found ${cells.length}`, { file, line: lineNumber });
    }
    const cell = (column: string): string | undefined => {
      const index = columns.indexOf(column);
      return index >= 0 ? cells[index] : undefined;
    };
    const number = (column: string, whole: boolean, fallback?: number): number => {
      const text = cell(column);
      if ((text === undefined || text === '') && fallback !== undefined) return fallback;
      const value = text === undefined || text === '' ? Number.NaN : Number(text);
      const problem = !Number.isFinite(value) ? `expected a number, got "${text ?? ''}"`
        : value < 0 ? `must be >= 0, got ${value}`
        : whole && !Number.isInteger(value) ? `must be a whole number of events, got ${value}`
        : undefined;
      if (problem !== undefined) throw new TamisError('schema', problem, where(columns.indexOf(column), column));
      return value;
    };
    const name = cell('name') ?? '';
    if (name === '') throw new TamisError('schema', 'a region needs a name', where(columns.indexOf('name'), 'name'));
    if (names.has(name)) throw new TamisError('schema', `region "${name}" appears twice`, where(columns.indexOf('name'), 'name'));
    names.add(name);
    const region: RegionRow = {
      name,
      observed: number('observed', true),
      background: number('background', false),
      backgroundUncertainty: number('uncertainty', false),
      signal: number('signal', false, 1),
      line: lineNumber,
    };
    if (cell('signal_uncertainty') !== undefined && cell('signal_uncertainty') !== '') region.signalUncertainty = number('signal_uncertainty', false);
    const group = cell('group');
    if (group !== undefined && group !== '') region.group = group;
    regions.push(region);
  }
  if (header === undefined) throw new TamisError('schema', 'no header line', { file, suggestion: `the first line names the columns: ${REQUIRED.join(',')}` });
  if (regions.length === 0) throw new TamisError('schema', 'no regions after the header line', { file });
  return regions;
}

/** Regions from a CSV file (see the module comment for the layout). */
export async function readRegionsCsv(file: string): Promise<RegionRow[]> {
  return parseRegionsCsv(readTextFile(file), file);
}
