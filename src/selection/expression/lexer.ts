/**
 * Tokens of the cut-expression language.
 *
 * The language (tamis's own, see analyses/README.md): comparisons of one
 * variable with numbers (`met > 50`, `50 <= met < 100`), combined with `and`,
 * `or`, `not` and parentheses. Every token keeps its character offset so that
 * errors can point at the exact column in the analysis file.
 */
import { TamisError } from '../../errors.js';

export type ComparisonOperator = '<' | '<=' | '>' | '>=' | '==' | '!=';

export type Token =
  | { kind: 'number'; value: number; text: string; start: number; end: number }
  | { kind: 'identifier'; text: string; start: number; end: number }
  | { kind: 'operator'; text: ComparisonOperator; start: number; end: number }
  | { kind: 'and' | 'or' | 'not' | '(' | ')' | 'end'; text: string; start: number; end: number };

/** Symbols borrowed from other languages, with what to write instead. */
const FOREIGN_SYMBOLS: readonly [string, string][] = [
  ['&&', "write 'and' instead of '&&'"],
  ['||', "write 'or' instead of '||'"],
  ['=<', "write '<=' instead of '=<'"],
  ['=>', "write '>=' instead of '=>'"],
  ['<>', "write '!=' instead of '<>'"],
  ['&', "write 'and' instead of '&'"],
  ['|', "write 'or' instead of '|'"],
  ['!', "write 'not' (or '!=' for 'not equal')"],
  ['=', "write '==' to compare for equality"],
];

const KEYWORDS: Readonly<Record<string, 'and' | 'or' | 'not'>> = { and: 'and', or: 'or', not: 'not' };

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

function isIdentifierStart(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || c === 95;
}

function isIdentifierPart(c: number): boolean {
  return isIdentifierStart(c) || isDigit(c);
}

/** Thrown for a problem at a character offset of the expression; the loader adds file, line and column. */
export function expressionError(message: string, offset: number, suggestion?: string): TamisError {
  const error = new TamisError('expression', message, suggestion === undefined ? {} : { suggestion });
  (error as TamisError & { offset?: number }).offset = offset;
  return error;
}

/** The character offset an expression error points at (0 when none was recorded). */
export function offsetOf(error: TamisError): number {
  return (error as TamisError & { offset?: number }).offset ?? 0;
}

/**
 * Splits an expression into tokens, ending with an `end` token.
 *
 * Numbers: decimal with optional fraction and exponent (`50`, `2.5`, `1e3`,
 * `.5`); a leading minus belongs to the number (`total_charge > -2`).
 *
 * @example
 * tokenize('met >= 50').map((t) => t.kind) // ['identifier', 'operator', 'number', 'end']
 */
export function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  const n = text.length;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === 32 || c === 9 || c === 10 || c === 13) {
      i++;
      continue;
    }
    const start = i;
    if (c === 40 || c === 41) {
      tokens.push({ kind: c === 40 ? '(' : ')', text: text[i]!, start, end: i + 1 });
      i++;
      continue;
    }
    const two = text.slice(i, i + 2);
    if (two === '<=' || two === '>=' || two === '==' || two === '!=') {
      tokens.push({ kind: 'operator', text: two, start, end: i + 2 });
      i += 2;
      continue;
    }
    if (c === 60 || c === 62) {
      tokens.push({ kind: 'operator', text: c === 60 ? '<' : '>', start, end: i + 1 });
      i++;
      continue;
    }
    const foreign = FOREIGN_SYMBOLS.find(([symbol]) => text.startsWith(symbol, i));
    if (foreign !== undefined) {
      throw expressionError(`unexpected '${foreign[0]}' at column ${i + 1}`, i, foreign[1]);
    }
    const next = i + 1 < n ? text.charCodeAt(i + 1) : 0;
    if (isDigit(c) || (c === 46 && isDigit(next)) || (c === 45 && (isDigit(next) || next === 46) && !followsOperand(tokens))) {
      i = scanNumber(text, i, tokens);
      continue;
    }
    if (c === 45 || c === 43 || c === 42 || c === 47) {
      throw expressionError(`unexpected '${text[i]}' at column ${i + 1}: cut expressions have no arithmetic`, i, 'compare one variable with numbers, e.g. 50 <= met < 100');
    }
    if (isIdentifierStart(c)) {
      while (i < n && isIdentifierPart(text.charCodeAt(i))) i++;
      const word = text.slice(start, i);
      const keyword = KEYWORDS[word.toLowerCase()];
      if (keyword !== undefined) {
        if (word !== keyword) throw expressionError(`write '${keyword}' in lower case, got '${word}' at column ${start + 1}`, start);
        tokens.push({ kind: keyword, text: word, start, end: i });
      } else {
        tokens.push({ kind: 'identifier', text: word, start, end: i });
      }
      continue;
    }
    const shown = String.fromCodePoint(text.codePointAt(i)!);
    throw expressionError(`unexpected character '${shown}' at column ${i + 1}`, i);
  }
  tokens.push({ kind: 'end', text: '', start: n, end: n });
  return tokens;
}

/** A minus sign after a number, variable or ')' would be subtraction, which the language does not have. */
function followsOperand(tokens: readonly Token[]): boolean {
  const last = tokens[tokens.length - 1];
  return last !== undefined && (last.kind === 'number' || last.kind === 'identifier' || last.kind === ')');
}

function scanNumber(text: string, start: number, tokens: Token[]): number {
  let i = start;
  const n = text.length;
  if (text.charCodeAt(i) === 45) i++;
  while (i < n && isDigit(text.charCodeAt(i))) i++;
  if (i < n && text.charCodeAt(i) === 46) {
    i++;
    while (i < n && isDigit(text.charCodeAt(i))) i++;
  }
  const e = i < n ? text.charCodeAt(i) : 0;
  if (e === 101 || e === 69) {
    let j = i + 1;
    const sign = j < n ? text.charCodeAt(j) : 0;
    if (sign === 43 || sign === 45) j++;
    if (j < n && isDigit(text.charCodeAt(j))) {
      while (j < n && isDigit(text.charCodeAt(j))) j++;
      i = j;
    } else {
      throw expressionError(`malformed number '${text.slice(start, j)}' at column ${start + 1}: the exponent has no digits`, start);
    }
  }
  if (i < n && (isIdentifierPart(text.charCodeAt(i)) || text.charCodeAt(i) === 46)) {
    let j = i;
    while (j < n && (isIdentifierPart(text.charCodeAt(j)) || text.charCodeAt(j) === 46)) j++;
    const word = text.slice(start, j);
    const unit = text.slice(i, j);
    const hint = /^(gev|tev|mev)$/i.test(unit) ? 'numbers are in GeV and take no unit: write the number alone' : undefined;
    throw expressionError(`malformed number '${word}' at column ${start + 1}`, start, hint);
  }
  const literal = text.slice(start, i);
  const value = Number(literal);
  if (!Number.isFinite(value)) throw expressionError(`number '${literal}' at column ${start + 1} is too large`, start);
  tokens.push({ kind: 'number', value, text: literal, start, end: i });
  return i;
}
