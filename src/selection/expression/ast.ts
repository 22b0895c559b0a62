/**
 * Syntax tree of a cut expression, and its canonical text.
 *
 * Comparisons always hold one variable and one or two numbers: `met > 50` is
 * a `compare` node, `50 <= met < 100` a `range` node. Offsets are character
 * positions in the source text, kept for error messages.
 */
import type { ComparisonOperator } from './lexer.js';

export type CutExpression =
  | { kind: 'or' | 'and'; left: CutExpression; right: CutExpression; start: number; end: number }
  | { kind: 'not'; operand: CutExpression; start: number; end: number }
  | {
      kind: 'compare';
      variable: string;
      /** The comparison read as `variable op value` (a written `50 < met` becomes `met > 50`). */
      op: ComparisonOperator;
      value: number;
      start: number;
      end: number;
      /** Offset of the variable name, for "unknown variable" messages. */
      variableStart: number;
    }
  | {
      kind: 'range';
      variable: string;
      /** Lower bound and whether it is included (`<=`), written on the left. */
      low: number;
      lowInclusive: boolean;
      high: number;
      highInclusive: boolean;
      start: number;
      end: number;
      variableStart: number;
    };

/** The comparison with the variable moved to the left: `50 < met` is `met > 50`. */
export function mirrorOperator(op: ComparisonOperator): ComparisonOperator {
  switch (op) {
    case '<':
      return '>';
    case '<=':
      return '>=';
    case '>':
      return '<';
    case '>=':
      return '<=';
    default:
      return op;
  }
}

function formatNumber(value: number): string {
  return String(value);
}

/**
 * Canonical text of an expression: fully parenthesised binary operators,
 * ranges written low to high. Parsing the text gives back the same tree.
 *
 * @example
 * printExpression(parseExpression('met>50 and not ht<200')) // '(met > 50 and not ht < 200)'
 */
export function printExpression(node: CutExpression): string {
  switch (node.kind) {
    case 'or':
    case 'and':
      return `(${printExpression(node.left)} ${node.kind} ${printExpression(node.right)})`;
    case 'not':
      return `not ${printExpression(node.operand)}`;
    case 'compare':
      return `${node.variable} ${node.op} ${formatNumber(node.value)}`;
    case 'range':
      return `${formatNumber(node.low)} ${node.lowInclusive ? '<=' : '<'} ${node.variable} ${node.highInclusive ? '<=' : '<'} ${formatNumber(node.high)}`;
  }
}

/** Names of the variables an expression reads, in order of first appearance. */
export function variablesOf(node: CutExpression, into: string[] = []): string[] {
  switch (node.kind) {
    case 'or':
    case 'and':
      variablesOf(node.left, into);
      variablesOf(node.right, into);
      break;
    case 'not':
      variablesOf(node.operand, into);
      break;
    default:
      if (!into.includes(node.variable)) into.push(node.variable);
  }
  return into;
}
