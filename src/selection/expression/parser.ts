/**
 * Recursive-descent parser of cut expressions.
 *
 * Grammar (precedence from loosest to tightest: or, and, not, comparison):
 *
 *   expression := and_expr ('or' and_expr)*
 *   and_expr   := unary ('and' unary)*
 *   unary      := 'not' unary | primary
 *   primary    := '(' expression ')' | comparison
 *   comparison := variable op number | number op variable
 *               | number op variable op number      (a range; both ops < / <= or both > / >=)
 *   op         := '<' | '<=' | '>' | '>=' | '==' | '!='
 *
 * Errors are `TamisError`s with code `expression` whose message names the
 * 1-based column inside the expression; `offsetOf(error)` gives the offset
 * for locating it in the file.
 */
import { expressionError, tokenize, type ComparisonOperator, type Token } from './lexer.js';
import { mirrorOperator, type CutExpression } from './ast.js';

/** Nesting deeper than this is certainly a mistake (and would exhaust the stack). */
const MAX_DEPTH = 200;
/** Longer expressions are certainly a mistake; the limit keeps every tree walk shallow. */
const MAX_TOKENS = 2000;

function describe(token: Token): string {
  return token.kind === 'end' ? 'end of expression' : `'${token.text}' at column ${token.start + 1}`;
}

class Parser {
  private position = 0;
  private depth = 0;

  constructor(private readonly tokens: Token[]) {}

  private peek(): Token {
    return this.tokens[this.position]!;
  }

  private take(): Token {
    return this.tokens[this.position++]!;
  }

  parse(): CutExpression {
    if (this.peek().kind === 'end') throw expressionError('empty cut expression', 0, 'write a comparison such as met > 50');
    const node = this.parseOr();
    const next = this.peek();
    if (next.kind !== 'end') {
      if (next.kind === ')') throw expressionError(`unexpected ')' at column ${next.start + 1}: no '(' to close`, next.start);
      const previous = this.tokens[this.position - 1];
      if (previous?.kind === 'number' && next.kind === 'identifier' && /^(gev|tev|mev)$/i.test(next.text)) {
        throw expressionError(`unexpected ${describe(next)}`, next.start, 'numbers are in GeV and take no unit');
      }
      throw expressionError(`unexpected ${describe(next)}`, next.start, "join comparisons with 'and' or 'or'");
    }
    return node;
  }

  private parseOr(): CutExpression {
    let left = this.parseAnd();
    while (this.peek().kind === 'or') {
      this.take();
      const right = this.parseAnd();
      left = { kind: 'or', left, right, start: left.start, end: right.end };
    }
    return left;
  }

  private parseAnd(): CutExpression {
    let left = this.parseUnary();
    while (this.peek().kind === 'and') {
      this.take();
      const right = this.parseUnary();
      left = { kind: 'and', left, right, start: left.start, end: right.end };
    }
    return left;
  }

  private parseUnary(): CutExpression {
    const token = this.peek();
    if (++this.depth > MAX_DEPTH) throw expressionError(`expression nested more than ${MAX_DEPTH} levels deep at column ${token.start + 1}`, token.start);
    try {
      if (token.kind === 'not') {
        this.take();
        const operand = this.parseUnary();
        return { kind: 'not', operand, start: token.start, end: operand.end };
      }
      return this.parsePrimary();
    } finally {
      this.depth--;
    }
  }

  private parsePrimary(): CutExpression {
    const token = this.peek();
    if (token.kind === '(') {
      this.take();
      if (this.peek().kind === ')') throw expressionError(`empty parentheses at column ${token.start + 1}`, token.start);
      const inner = this.parseOr();
      const close = this.peek();
      if (close.kind !== ')') {
        const where = close.kind === 'end' ? 'the expression ends' : `found ${describe(close)}`;
        throw expressionError(`missing ')' to close the '(' at column ${token.start + 1}: ${where}`, close.start);
      }
      this.take();
      return { ...inner, start: token.start, end: close.end };
    }
    if (token.kind === 'number' || token.kind === 'identifier') return this.parseComparison();
    if (token.kind === 'end') throw expressionError('the expression ends too early: expected a comparison', token.start);
    if (token.kind === 'operator') throw expressionError(`unexpected ${describe(token)}: a comparison starts with a variable or a number`, token.start);
    throw expressionError(`unexpected ${describe(token)}: expected a comparison such as met > 50`, token.start);
  }

  private expectOperator(after: Token): Token & { kind: 'operator' } {
    const token = this.peek();
    if (token.kind === 'operator') return this.take() as Token & { kind: 'operator' };
    if (after.kind === 'number' && token.kind === 'identifier' && /^(gev|tev|mev)$/i.test(token.text)) {
      throw expressionError(`unexpected unit '${token.text}' at column ${token.start + 1}`, token.start, 'numbers are in GeV and take no unit');
    }
    const what = token.kind === 'end' ? 'the expression ends' : `found ${describe(token)}`;
    const example = after.kind === 'identifier' ? `${after.text} > 0` : `met > ${after.text}`;
    throw expressionError(`expected a comparison operator (<, <=, >, >=, ==, !=) after '${after.text}', ${what}`, token.kind === 'end' ? after.end : token.start, `for example ${example}`);
  }

  private expectOperand(after: Token): Token {
    const token = this.peek();
    if (token.kind === 'number' || token.kind === 'identifier') return this.take();
    const what = token.kind === 'end' ? 'the expression ends' : `found ${describe(token)}`;
    throw expressionError(`expected a variable or a number after '${after.text}', ${what}`, token.start);
  }

  private parseComparison(): CutExpression {
    const first = this.take();
    const op1 = this.expectOperator(first);
    const second = this.expectOperand(op1);
    if (this.peek().kind !== 'operator') return makeComparison(first, op1, second);
    const op2 = this.take() as Token & { kind: 'operator' };
    const third = this.expectOperand(op2);
    if (this.peek().kind === 'operator') {
      const extra = this.peek();
      throw expressionError(`unexpected ${describe(extra)}: a range has at most two comparison operators`, extra.start);
    }
    return makeRange(first, op1, second, op2, third);
  }
}

function makeComparison(first: Token, op: Token & { kind: 'operator' }, second: Token): CutExpression {
  if (first.kind === 'identifier' && second.kind === 'number') {
    return { kind: 'compare', variable: first.text, op: op.text, value: second.value, start: first.start, end: second.end, variableStart: first.start };
  }
  if (first.kind === 'number' && second.kind === 'identifier') {
    return { kind: 'compare', variable: second.text, op: mirrorOperator(op.text), value: first.value, start: first.start, end: second.end, variableStart: second.start };
  }
  if (first.kind === 'identifier' && second.kind === 'identifier') {
    throw expressionError(`'${first.text} ${op.text} ${second.text}' compares two variables at column ${first.start + 1}: compare a variable with a number`, first.start);
  }
  throw expressionError(`'${first.text} ${op.text} ${second.text}' at column ${first.start + 1} compares two numbers: a comparison needs a variable`, first.start);
}

const ASCENDING: ReadonlySet<ComparisonOperator> = new Set(['<', '<=']);
const DESCENDING: ReadonlySet<ComparisonOperator> = new Set(['>', '>=']);

function makeRange(
  first: Token,
  op1: Token & { kind: 'operator' },
  middle: Token,
  op2: Token & { kind: 'operator' },
  last: Token,
): CutExpression {
  const example = 'write a range as number op variable op number, e.g. 50 <= met < 100';
  if (first.kind !== 'number' || middle.kind !== 'identifier' || last.kind !== 'number') {
    throw expressionError(`a range needs a number, a variable and a number, got '${first.text} ${op1.text} ${middle.text} ${op2.text} ${last.text}' at column ${first.start + 1}`, first.start, example);
  }
  const ascending = ASCENDING.has(op1.text) && ASCENDING.has(op2.text);
  const descending = DESCENDING.has(op1.text) && DESCENDING.has(op2.text);
  if (!ascending && !descending) {
    throw expressionError(`a range must run in one direction: '${op1.text}' at column ${op1.start + 1} and '${op2.text}' at column ${op2.start + 1} do not`, op2.start, example);
  }
  const low = ascending ? first : last;
  const high = ascending ? last : first;
  const lowInclusive = (ascending ? op1.text : op2.text).length === 2;
  const highInclusive = (ascending ? op2.text : op1.text).length === 2;
  if (low.value > high.value || (low.value === high.value && !(lowInclusive && highInclusive))) {
    throw expressionError(`the range at column ${first.start + 1} is empty: no value of ${middle.text} lies between ${low.value} and ${high.value}`, first.start);
  }
  return { kind: 'range', variable: middle.text, low: low.value, lowInclusive, high: high.value, highInclusive, start: first.start, end: last.end, variableStart: middle.start };
}

/**
 * Parses a cut expression into its syntax tree. Throws a `TamisError`
 * (code `expression`) naming the column of the offending token.
 *
 * @example
 * parseExpression('50 <= met < 100').kind // 'range'
 */
export function parseExpression(text: string): CutExpression {
  const tokens = tokenize(text);
  if (tokens.length > MAX_TOKENS) {
    throw expressionError(`expression has ${tokens.length - 1} tokens, more than the ${MAX_TOKENS - 1} allowed`, 0, 'split it into several cuts, which are joined by and');
  }
  return new Parser(tokens).parse();
}
