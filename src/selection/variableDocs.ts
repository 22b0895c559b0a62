/**
 * The documentation of the variable table, generated from `VARIABLES`:
 * a Markdown table for analyses/README.md (kept between two marker comments
 * and checked by a test) and a plain-text table for `tamis variables`.
 */
import { TamisError } from '../errors.js';
import { VARIABLES } from './variables.js';

export const VARIABLE_TABLE_START = '<!-- variable table: generated from src/selection/variables.ts, do not edit by hand -->';
export const VARIABLE_TABLE_END = '<!-- end of variable table -->';

/** Markdown table of every variable: name, unit, definition. */
export function variableTableMarkdown(): string {
  const rows = VARIABLES.map((v) => `| \`${v.name}\` | ${v.unit} | ${v.description.replace(/\|/g, '\\|')} |`);
  return ['| variable | unit | definition |', '|---|---|---|', ...rows].join('\n');
}

/** Plain-text table for the terminal. */
export function variableTableText(): string {
  const width = Math.max(...VARIABLES.map((v) => v.name.length));
  return VARIABLES.map((v) => `${v.name.padEnd(width)}  ${v.unit.padEnd(5)}  ${v.description}`).join('\n');
}

/**
 * `readme` with the text between the variable-table markers replaced by the
 * current table.
 *
 * @throws TamisError (`internal`) when the markers are missing
 */
export function withVariableTable(readme: string): string {
  const start = readme.indexOf(VARIABLE_TABLE_START);
  const end = readme.indexOf(VARIABLE_TABLE_END);
  if (start < 0 || end < start) throw new TamisError('internal', 'analyses/README.md lacks the variable-table markers');
  return `${readme.slice(0, start + VARIABLE_TABLE_START.length)}\n${variableTableMarkdown()}\n${readme.slice(end)}`;
}
