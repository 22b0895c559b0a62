import { describe, expect, it } from 'vitest';
import { TamisError, formatError } from '../../src/errors.js';
import { printExpression, type CutExpression } from '../../src/selection/expression/ast.js';
import { compileExpression } from '../../src/selection/expression/compile.js';
import { offsetOf, tokenize } from '../../src/selection/expression/lexer.js';
import { parseExpression } from '../../src/selection/expression/parser.js';

/** Strips offsets so trees can be compared by structure. */
function shape(node: CutExpression): unknown {
  switch (node.kind) {
    case 'and':
    case 'or':
      return [node.kind, shape(node.left), shape(node.right)];
    case 'not':
      return ['not', shape(node.operand)];
    case 'compare':
      return [node.variable, node.op, node.value];
    case 'range':
      return [node.low, node.lowInclusive ? '<=' : '<', node.variable, node.highInclusive ? '<=' : '<', node.high];
  }
}

function parseError(text: string): TamisError {
  try {
    parseExpression(text);
  } catch (error) {
    if (error instanceof TamisError) return error;
    throw error;
  }
  throw new Error(`expected "${text}" to fail`);
}

describe('cut expression parser: structure and precedence', () => {
  it('reads variable op number, and number op variable as its mirror', () => {
    expect(shape(parseExpression('met > 50'))).toEqual(['met', '>', 50]);
    expect(shape(parseExpression('50 < met'))).toEqual(['met', '>', 50]);
    expect(shape(parseExpression('2 >= n_leptons'))).toEqual(['n_leptons', '<=', 2]);
    expect(shape(parseExpression('n_bjets == 0'))).toEqual(['n_bjets', '==', 0]);
    expect(shape(parseExpression('n_taus != 1'))).toEqual(['n_taus', '!=', 1]);
  });

  it('reads chained ranges in both directions', () => {
    expect(shape(parseExpression('50 <= met < 100'))).toEqual([50, '<=', 'met', '<', 100]);
    expect(shape(parseExpression('100 > met >= 50'))).toEqual([50, '<=', 'met', '<', 100]);
    expect(shape(parseExpression('81.2 < mll_z <= 101.2'))).toEqual([81.2, '<', 'mll_z', '<=', 101.2]);
  });

  it('binds not tighter than and, and tighter than or (left to right within a level)', () => {
    expect(shape(parseExpression('a > 1 or b > 2 and c > 3'))).toEqual(['or', ['a', '>', 1], ['and', ['b', '>', 2], ['c', '>', 3]]]);
    expect(shape(parseExpression('not a > 1 and b > 2'))).toEqual(['and', ['not', ['a', '>', 1]], ['b', '>', 2]]);
    expect(shape(parseExpression('a > 1 and b > 2 and c > 3'))).toEqual(['and', ['and', ['a', '>', 1], ['b', '>', 2]], ['c', '>', 3]]);
    expect(shape(parseExpression('(a > 1 or b > 2) and c > 3'))).toEqual(['and', ['or', ['a', '>', 1], ['b', '>', 2]], ['c', '>', 3]]);
    expect(shape(parseExpression('not not (a > 1)'))).toEqual(['not', ['not', ['a', '>', 1]]]);
  });

  it('reads numbers with fractions, exponents and signs', () => {
    expect(shape(parseExpression('total_charge > -2'))).toEqual(['total_charge', '>', -2]);
    expect(shape(parseExpression('met>1.5e2'))).toEqual(['met', '>', 150]);
    expect(shape(parseExpression('met >= .5'))).toEqual(['met', '>=', 0.5]);
    expect(shape(parseExpression('-1.5 <= total_charge <= 2E0'))).toEqual([-1.5, '<=', 'total_charge', '<=', 2]);
  });

  it('keeps token offsets for messages', () => {
    const tokens = tokenize('  met >= 50');
    expect(tokens.map((t) => [t.kind, t.start])).toEqual([['identifier', 2], ['operator', 6], ['number', 9], ['end', 11]]);
  });

  it('prints a canonical text that parses back to the same tree', () => {
    const tree = parseExpression('not 50 <= met < 100 or n_jets >= 2 and ht > 200');
    expect(printExpression(tree)).toBe('(not 50 <= met < 100 or (n_jets >= 2 and ht > 200))');
    expect(shape(parseExpression(printExpression(tree)))).toEqual(shape(tree));
  });
});

describe('cut expression parser: errors name the column of the offending token', () => {
  const cases: [text: string, message: RegExp, column: number][] = [
    ['(met > 50 and ht > 200))', /unexpected '\)' at column 24: no '\(' to close/, 24],
    ['(met > 50', /missing '\)' to close the '\(' at column 1/, 10],
    ['met > 50 ht > 200', /unexpected 'ht' at column 10/, 10],
    ['met >', /expected a variable or a number after '>', the expression ends/, 6],
    ['met', /expected a comparison operator .* after 'met', the expression ends/, 4],
    ['met = 50', /unexpected '=' at column 5/, 5],
    ['met > 50 && ht > 100', /unexpected '&&' at column 10/, 10],
    ['met > 50 GeV', /unexpected 'GeV' at column 10/, 10],
    ['met > 50GeV', /malformed number '50GeV' at column 7/, 7],
    ['met - ht > 50', /unexpected '-' at column 5: cut expressions have no arithmetic/, 5],
    ['met > ht', /compares two variables at column 1/, 1],
    ['50 < 100', /compares two numbers/, 1],
    ['50 < met > 20', /a range must run in one direction/, 10],
    ['100 <= met < 50', /the range at column 1 is empty/, 1],
    ['met < 50 < 100', /a range needs a number, a variable and a number/, 1],
    ['10 < met < 20 < 30', /a range has at most two comparison operators/, 15],
    ['', /empty cut expression/, 1],
    ['()', /empty parentheses at column 1/, 1],
    ['met > 1e', /the exponent has no digits/, 7],
    ['met > 1e999', /too large/, 7],
    ['met > 50 AND ht > 1', /write 'and' in lower case/, 10],
    ['and met > 5', /unexpected 'and' at column 1/, 1],
    ['met > 50 or', /the expression ends too early/, 12],
    ['mét > 50', /unexpected character 'é' at column 2/, 2],
  ];
  for (const [text, message, column] of cases) {
    it(`"${text}" -> ${message.source}`, () => {
      const error = parseError(text);
      expect(error.code).toBe('expression');
      expect(error.message).toMatch(message);
      expect(offsetOf(error) + 1).toBe(column);
    });
  }

  it('suggests the language\'s own words for borrowed symbols', () => {
    expect(parseError('met > 50 || ht > 1').suggestion).toMatch(/write 'or'/);
    expect(parseError('!(met > 50)').suggestion).toMatch(/write 'not'/);
    expect(formatError(parseError('met > 50 GeV'))).toMatch(/hint: numbers are in GeV/);
  });

  it('refuses absurdly deep nesting and absurdly long expressions with a message, not a stack overflow', () => {
    expect(parseError('('.repeat(500) + 'met > 1' + ')'.repeat(500)).message).toMatch(/nested more than/);
    expect(parseError(Array.from({ length: 3000 }, () => 'met > 1').join(' and ')).message).toMatch(/more than the \d+ allowed/);
  });
});

// ---------------------------------------------------------------------------
// Property test: random trees, printed in random surface forms, parsed,
// compiled and evaluated, against a direct evaluation of the original tree.

/** Small seeded generator for the test (mulberry32, public domain). */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NAMES = ['met', 'ht', 'n_jets', 'x1'];
const THRESHOLDS = [-3, -0.5, 0, 1, 2, 2.5, 50, 100, 150, 1e3];

function randomTree(rand: () => number, depth: number): CutExpression {
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rand() * list.length)]!;
  const roll = rand();
  const base = { start: 0, end: 0 };
  if (depth > 0 && roll < 0.5) {
    const kind = rand() < 0.5 ? 'and' : 'or';
    return { kind, left: randomTree(rand, depth - 1), right: randomTree(rand, depth - 1), ...base };
  }
  if (depth > 0 && roll < 0.62) return { kind: 'not', operand: randomTree(rand, depth - 1), ...base };
  const variable = pick(NAMES);
  if (rand() < 0.3) {
    let low = pick(THRESHOLDS);
    let high = pick(THRESHOLDS);
    if (low > high) [low, high] = [high, low];
    const lowInclusive = low === high || rand() < 0.5;
    const highInclusive = low === high || rand() < 0.5;
    return { kind: 'range', variable, low, lowInclusive, high, highInclusive, variableStart: 0, ...base };
  }
  return { kind: 'compare', variable, op: pick(['<', '<=', '>', '>=', '==', '!='] as const), value: pick(THRESHOLDS), variableStart: 0, ...base };
}

const PRECEDENCE = { or: 1, and: 2, not: 3, compare: 4, range: 4 } as const;

/** Prints a tree with minimal or extra parentheses, mirrored comparisons and random spacing. */
function randomText(node: CutExpression, rand: () => number): string {
  const space = () => [' ', '  ', '\t', ' '][Math.floor(rand() * 4)]!;
  const num = (v: number) => (rand() < 0.2 && v !== 0 ? v.toExponential() : String(v));
  const wrap = (child: CutExpression, parentLevel: number, rightOfSame: boolean) => {
    const text = randomText(child, rand);
    const needs = PRECEDENCE[child.kind] < parentLevel || rightOfSame;
    return needs || rand() < 0.15 ? `(${space()}${text}${space()})` : text;
  };
  switch (node.kind) {
    case 'and':
    case 'or':
      return `${wrap(node.left, PRECEDENCE[node.kind], false)}${space()}${node.kind}${space()}${wrap(node.right, PRECEDENCE[node.kind], node.right.kind === node.kind)}`;
    case 'not':
      return `not${space()}${wrap(node.operand, PRECEDENCE.not, false)}`;
    case 'compare': {
      if (rand() < 0.5) return `${node.variable}${space()}${node.op}${space()}${num(node.value)}`;
      const mirrored = { '<': '>', '<=': '>=', '>': '<', '>=': '<=', '==': '==', '!=': '!=' }[node.op];
      return `${num(node.value)}${space()}${mirrored}${space()}${node.variable}`;
    }
    case 'range': {
      const lo = node.lowInclusive ? '<=' : '<';
      const hi = node.highInclusive ? '<=' : '<';
      if (rand() < 0.5) return `${num(node.low)}${space()}${lo}${space()}${node.variable}${space()}${hi}${space()}${num(node.high)}`;
      return `${num(node.high)} ${hi.replace('<', '>')} ${node.variable} ${lo.replace('<', '>')} ${num(node.low)}`;
    }
  }
}

/** Direct TypeScript evaluation of a tree: the reference the compiled closure must agree with. */
function evaluateTree(node: CutExpression, values: Record<string, number>): boolean {
  switch (node.kind) {
    case 'and':
      return evaluateTree(node.left, values) && evaluateTree(node.right, values);
    case 'or':
      return evaluateTree(node.left, values) || evaluateTree(node.right, values);
    case 'not':
      return !evaluateTree(node.operand, values);
    case 'compare': {
      const v = values[node.variable]!;
      const t = node.value;
      return { '<': v < t, '<=': v <= t, '>': v > t, '>=': v >= t, '==': v === t, '!=': v !== t }[node.op];
    }
    case 'range': {
      const v = values[node.variable]!;
      const aboveLow = node.lowInclusive ? v >= node.low : v > node.low;
      const belowHigh = node.highInclusive ? v <= node.high : v < node.high;
      return aboveLow && belowHigh;
    }
  }
}

describe('cut expression parser: property test against direct evaluation', () => {
  it('2000 random trees (seed 20240611) evaluate identically after print -> parse -> compile, 8 assignments each', () => {
    const rand = mulberry32(20240611);
    let trueCount = 0;
    let checked = 0;
    for (let t = 0; t < 2000; t++) {
      const tree = randomTree(rand, 4);
      const text = randomText(tree, rand);
      const parsed = parseExpression(text);
      // Canonical print of the parsed tree parses to the same structure.
      expect(shape(parseExpression(printExpression(parsed)))).toEqual(shape(parsed));
      const compiled = compileExpression(parsed, (name) => NAMES.indexOf(name));
      for (let k = 0; k < 8; k++) {
        const values: Record<string, number> = {};
        // Values on thresholds half of the time, to exercise inclusive versus exclusive bounds.
        for (const name of NAMES) values[name] = rand() < 0.5 ? THRESHOLDS[Math.floor(rand() * THRESHOLDS.length)]! : (rand() - 0.3) * 300;
        const reader = { value: (slot: number) => values[NAMES[slot]!]! };
        const expected = evaluateTree(tree, values);
        if (compiled(reader) !== expected) expect.fail(`"${text}" with ${JSON.stringify(values)}: compiled ${!expected}, direct ${expected}`);
        if (expected) trueCount++;
        checked++;
      }
    }
    // Both outcomes occur often enough for the comparison to mean something.
    expect(trueCount).toBeGreaterThan(checked * 0.2);
    expect(trueCount).toBeLessThan(checked * 0.8);
  });
});
