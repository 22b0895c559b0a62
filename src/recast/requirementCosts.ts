/**
 * What each requirement costs an analysis: the signal its signal regions
 * would hold if the analysis placed no condition at all on one variable
 * (missing transverse momentum, HT, the b-jet count, ...), in its steps and in
 * every region. This is the view that shows why a search with a
 * missing-momentum requirement misses a signal without invisible particles:
 * binned regions repeat a variable's condition in every bin, so dropping one
 * written cut alone says little, while dropping the variable says it all.
 *
 * It is computed by running variants of the analysis through the same
 * selection: `#union` (one region, the union of the signal regions, to which
 * the variants compare) and `#without:<variable>` (every condition on that
 * variable made to pass: true where it is not negated, false under an odd
 * number of `not`s, so that dropping it never tightens a cut).
 */
import type { Analysis, Cut } from '../selection/analysis.js';
import { printExpression, variablesOf, type CutExpression } from '../selection/expression/ast.js';
import type { AnalysisResult } from '../selection/results.js';

export interface RequirementCost {
  variable: string;
  /** Efficiency of the signal regions (their union) without any condition on the variable. */
  efficiencyWithout: number;
  /** efficiencyWithout / efficiency of the union with every condition (Infinity when that is 0). */
  gainFactor: number;
}

const UNION = '#union';
const WITHOUT = '#without:';

/** A relaxed expression: a constant, or an expression without conditions on the relaxed variable. */
type Relaxed = boolean | CutExpression;

/**
 * Drops the conditions on `variable`: each becomes "passes" where it is not
 * negated and "fails" under an odd number of `not`s (so that dropping it never
 * tightens a cut), and constants are folded away.
 */
function relax(node: CutExpression, variable: string | undefined, negated: boolean): Relaxed {
  switch (node.kind) {
    case 'and':
    case 'or': {
      const left = relax(node.left, variable, negated);
      const right = relax(node.right, variable, negated);
      const absorbing = node.kind === 'or';
      if (left === absorbing || right === absorbing) return absorbing;
      if (typeof left === 'boolean') return right;
      if (typeof right === 'boolean') return left;
      return { ...node, left, right };
    }
    case 'not': {
      const operand = relax(node.operand, variable, !negated);
      return typeof operand === 'boolean' ? !operand : { ...node, operand };
    }
    default:
      return node.variable === variable ? !negated : node;
  }
}

/** An always-true (`x != NaN`) or always-false (`x == NaN`) atom, for a constant that must stay an expression. */
function constant(variable: string, value: boolean): CutExpression {
  return { kind: 'compare', variable, op: value ? '!=' : '==', value: Number.NaN, start: 0, end: 0, variableStart: 0 };
}

/** A balanced tree of `and` or `or` (shallow closures evaluate faster than a long chain). */
function balanced(kind: 'and' | 'or', nodes: readonly CutExpression[]): CutExpression {
  if (nodes.length === 1) return nodes[0]!;
  const middle = nodes.length >> 1;
  return { kind, left: balanced(kind, nodes.slice(0, middle)), right: balanced(kind, nodes.slice(middle)), start: 0, end: 0 };
}

/** The conjunction of relaxed cuts (a constant when one fails or all pass). */
function conjunction(cuts: readonly Relaxed[]): Relaxed {
  if (cuts.includes(false)) return false;
  const kept = cuts.filter((c): c is CutExpression => c !== true);
  return kept.length === 0 ? true : balanced('and', kept);
}

function cutOf(expression: Relaxed, like: Cut, variable: string): Cut {
  const e = typeof expression === 'boolean' ? constant(variable, expression) : expression;
  return { text: printExpression(e), expression: e, location: like.location };
}

/** Variables the analysis places conditions on (steps and regions), in order of appearance. */
export function requirementVariables(analysis: Analysis): string[] {
  const names: string[] = [];
  for (const s of analysis.steps) variablesOf(s.cut.expression, names);
  for (const r of analysis.regions) for (const c of r.cuts) variablesOf(c.expression, names);
  return names;
}

/** The union variant and one variant per variable, as analyses the selection engine runs. */
export function requirementVariants(analysis: Analysis): Analysis[] {
  const first = analysis.regions[0]!;
  const anyVariable = requirementVariables(analysis)[0] ?? 'met';
  const build = (suffix: string, variable: string | undefined): Analysis => {
    // Regions that differ only in the relaxed variable become one clause.
    const clauses = new Map<string, CutExpression>();
    let always = false;
    for (const region of analysis.regions) {
      const clause = conjunction(region.cuts.map((c) => relax(c.expression, variable, false)));
      if (clause === true) always = true;
      else if (clause !== false) clauses.set(printExpression(clause), clause);
    }
    const union: Relaxed = always ? true : clauses.size === 0 ? false : balanced('or', [...clauses.values()]);
    return {
      ...analysis,
      id: `${analysis.id}${suffix}`,
      steps: analysis.steps.map((s) => ({ name: s.name, cut: cutOf(relax(s.cut.expression, variable, false), s.cut, anyVariable) })),
      regions: [{ ...first, name: 'union of the signal regions', cuts: [cutOf(union, first.cuts[0]!, anyVariable)] }],
      regionsDisjoint: false,
      correlationGroups: [],
    };
  };
  return [build(UNION, undefined), ...requirementVariables(analysis).map((v) => build(`${WITHOUT}${v}`, v))];
}

/** True for the ids of variants made here (they are not reported as analyses). */
export function isRequirementVariant(id: string): boolean {
  return id.includes(UNION) || id.includes(WITHOUT);
}

/** Costs of every requirement of `analysis`, costliest first, from the variants' results. */
export function requirementCosts(analysis: Analysis, results: ReadonlyMap<string, AnalysisResult>): RequirementCost[] {
  const union = results.get(`${analysis.id}${UNION}`);
  if (union === undefined) return [];
  const base = union.regions[0]!.efficiency;
  const costs = requirementVariables(analysis).map((variable) => {
    const without = results.get(`${analysis.id}${WITHOUT}${variable}`)!.regions[0]!.efficiency;
    return { variable, efficiencyWithout: without, gainFactor: base > 0 ? without / base : without > 0 ? Infinity : 1 };
  });
  return costs.map((c, i) => ({ c, i })).sort((a, b) => b.c.efficiencyWithout - a.c.efficiencyWithout || a.i - b.i).map((x) => x.c);
}
