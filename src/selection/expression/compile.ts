/**
 * Compilation of a cut-expression tree into a closure, done once per
 * analysis: evaluating a cut then costs a few function calls and no
 * allocation, and the text is never handed to `eval`.
 */
import { TamisError } from '../../errors.js';
import type { CutExpression } from './ast.js';

/** Where a compiled cut reads its variables: `value(slot)` for a slot fixed at compile time. */
export interface VariableReader {
  value(slot: number): number;
}

export type CompiledCut = (reader: VariableReader) => boolean;

/**
 * Turns a tree into a predicate. `slotOf` maps a variable name to the slot
 * the reader serves it from (the loader has already checked that every name
 * is known).
 *
 * @example
 * const cut = compileExpression(parseExpression('met > 50'), () => 0);
 * cut({ value: () => 80 }) // true
 */
export function compileExpression(node: CutExpression, slotOf: (variable: string) => number): CompiledCut {
  switch (node.kind) {
    case 'and': {
      const left = compileExpression(node.left, slotOf);
      const right = compileExpression(node.right, slotOf);
      return (r) => left(r) && right(r);
    }
    case 'or': {
      const left = compileExpression(node.left, slotOf);
      const right = compileExpression(node.right, slotOf);
      return (r) => left(r) || right(r);
    }
    case 'not': {
      const operand = compileExpression(node.operand, slotOf);
      return (r) => !operand(r);
    }
    case 'compare': {
      const s = slotOf(node.variable);
      const t = node.value;
      switch (node.op) {
        case '<':
          return (r) => r.value(s) < t;
        case '<=':
          return (r) => r.value(s) <= t;
        case '>':
          return (r) => r.value(s) > t;
        case '>=':
          return (r) => r.value(s) >= t;
        case '==':
          return (r) => r.value(s) === t;
        case '!=':
          return (r) => r.value(s) !== t;
      }
      break;
    }
    case 'range': {
      const s = slotOf(node.variable);
      const lo = node.low;
      const hi = node.high;
      if (node.lowInclusive && node.highInclusive) return (r) => { const v = r.value(s); return v >= lo && v <= hi; };
      if (node.lowInclusive) return (r) => { const v = r.value(s); return v >= lo && v < hi; };
      if (node.highInclusive) return (r) => { const v = r.value(s); return v > lo && v <= hi; };
      return (r) => { const v = r.value(s); return v > lo && v < hi; };
    }
  }
  throw new TamisError('internal', `cannot compile expression node ${JSON.stringify((node as { kind: string }).kind)}`);
}
