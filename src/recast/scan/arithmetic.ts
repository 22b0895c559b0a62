/**
 * Arithmetic formulas for derived scan parameters, e.g. `mass / ratio` or
 * `2 * mass + 50`: numbers, parameter names, + - * / ^, parentheses and the
 * functions sqrt, exp, log, abs, min, max. Parsed once by recursive descent
 * (never eval) into a closure; errors give the column of the offending token.
 */
import { TamisError } from '../../errors.js';

export type Formula = (parameters: Readonly<Record<string, number>>) => number;

export interface ParsedFormula {
  evaluate: Formula;
  /** Parameter names the formula reads. */
  names: readonly string[];
}

interface Token {
  kind: 'number' | 'name' | 'op' | 'end';
  text: string;
  value: number;
  column: number; // 0-based offset in the text
}

const FUNCTIONS: Record<string, { arity: number; apply: (a: number[]) => number }> = {
  sqrt: { arity: 1, apply: (a) => Math.sqrt(a[0]!) },
  exp: { arity: 1, apply: (a) => Math.exp(a[0]!) },
  log: { arity: 1, apply: (a) => Math.log(a[0]!) },
  abs: { arity: 1, apply: (a) => Math.abs(a[0]!) },
  min: { arity: 2, apply: (a) => Math.min(a[0]!, a[1]!) },
  max: { arity: 2, apply: (a) => Math.max(a[0]!, a[1]!) },
};

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (c === ' ' || c === '\t') {
      i++;
      continue;
    }
    const number = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/.exec(text.slice(i));
    if (number) {
      tokens.push({ kind: 'number', text: number[0], value: Number(number[0]), column: i });
      i += number[0].length;
      continue;
    }
    const name = /^[A-Za-z_][A-Za-z0-9_]*/.exec(text.slice(i));
    if (name) {
      tokens.push({ kind: 'name', text: name[0], value: 0, column: i });
      i += name[0].length;
      continue;
    }
    if ('+-*/^(),'.includes(c)) {
      tokens.push({ kind: 'op', text: c, value: 0, column: i });
      i++;
      continue;
    }
    throw new FormulaError(`unexpected character '${c}'`, i);
  }
  tokens.push({ kind: 'end', text: 'end of formula', value: 0, column: text.length });
  return tokens;
}

/** A formula syntax error; `offset` is the 0-based character position in the formula text. */
export class FormulaError extends TamisError {
  readonly offset: number;
  constructor(message: string, offset: number) {
    super('expression', `${message} at column ${offset + 1} of the formula`);
    this.offset = offset;
  }
}

/**
 * Parses a formula over the allowed parameter names.
 *
 * @example
 * parseFormula('mass / ratio', ['mass', 'ratio']).evaluate({ mass: 300, ratio: 0.5 }) // 600
 */
export function parseFormula(text: string, allowedNames: readonly string[]): ParsedFormula {
  const tokens = tokenize(text);
  let position = 0;
  const names = new Set<string>();
  const peek = (): Token => tokens[position]!;
  const next = (): Token => tokens[position++]!;
  const expectOp = (op: string): void => {
    const t = next();
    if (t.kind !== 'op' || t.text !== op) throw new FormulaError(`expected '${op}', got '${t.text}'`, t.column);
  };

  const expression = (): Formula => {
    let left = term();
    for (;;) {
      const t = peek();
      if (t.kind === 'op' && (t.text === '+' || t.text === '-')) {
        next();
        const right = term();
        const l = left;
        left = t.text === '+' ? (p) => l(p) + right(p) : (p) => l(p) - right(p);
      } else return left;
    }
  };
  const term = (): Formula => {
    let left = power();
    for (;;) {
      const t = peek();
      if (t.kind === 'op' && (t.text === '*' || t.text === '/')) {
        next();
        const right = power();
        const l = left;
        left = t.text === '*' ? (p) => l(p) * right(p) : (p) => l(p) / right(p);
      } else return left;
    }
  };
  // '^' is right-associative and binds tighter than unary minus on its left: -2^2 = -4.
  const power = (): Formula => {
    const t = peek();
    if (t.kind === 'op' && (t.text === '-' || t.text === '+')) {
      next();
      const operand = power();
      return t.text === '-' ? (p) => -operand(p) : operand;
    }
    const base = primary();
    const op = peek();
    if (op.kind === 'op' && op.text === '^') {
      next();
      const exponent = power();
      return (p) => Math.pow(base(p), exponent(p));
    }
    return base;
  };
  const primary = (): Formula => {
    const t = next();
    if (t.kind === 'number') {
      const v = t.value;
      return () => v;
    }
    if (t.kind === 'name') {
      const fn = FUNCTIONS[t.text];
      if (fn !== undefined && peek().kind === 'op' && peek().text === '(') {
        next();
        const args: Formula[] = [expression()];
        while (peek().kind === 'op' && peek().text === ',') {
          next();
          args.push(expression());
        }
        expectOp(')');
        if (args.length !== fn.arity) throw new FormulaError(`${t.text}() takes ${fn.arity} argument${fn.arity > 1 ? 's' : ''}, got ${args.length}`, t.column);
        const scratch = new Array<number>(args.length);
        return (p) => {
          for (let k = 0; k < args.length; k++) scratch[k] = args[k]!(p);
          return fn.apply(scratch);
        };
      }
      if (!allowedNames.includes(t.text)) {
        throw new FormulaError(`unknown parameter "${t.text}"; known parameters: ${allowedNames.join(', ') || '(none)'}`, t.column);
      }
      names.add(t.text);
      const name = t.text;
      return (p) => {
        const v = p[name];
        if (v === undefined) throw new TamisError('internal', `parameter ${name} has no value`);
        return v;
      };
    }
    if (t.kind === 'op' && t.text === '(') {
      const inner = expression();
      expectOp(')');
      return inner;
    }
    throw new FormulaError(`unexpected '${t.text}'`, t.column);
  };

  const evaluate = expression();
  const last = peek();
  if (last.kind !== 'end') throw new FormulaError(`unexpected '${last.text}'`, last.column);
  return { evaluate, names: [...names] };
}
