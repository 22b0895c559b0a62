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

/** An always-true (`x != NaN`) or always-false (`x == NaN`) atom on a variable. */
function constant(variable: string, value: boolean): CutExpression {
  return { kind: 'compare', variable, op: value ? '!=' : '==', value: Number.NaN, start: 0, end: 0, variableStart: 0 };
}

function relax(node: CutExpression, variable: string, negated: boolean): CutExpression {
  switch (node.kind) {
    case 'or':
    case 'and':
      return { ...node, left: relax(node.left, variable, negated), right: relax(node.right, variable, negated) };
    case 'not':
      return { ...node, operand: relax(node.operand, variable, !negated) };
    default:
      return node.variable === variable ? constant(variable, !negated) : node;
  }
}

function conjunction(nodes: readonly CutExpression[]): CutExpression {
  return nodes.reduce((left, right) => ({ kind: 'and', left, right, start: 0, end: 0 }));
}

function cutOf(expression: CutExpression, like: Cut): Cut {
  return { text: printExpression(expression), expression, location: like.location };
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
  const build = (suffix: string, variable: string | undefined): Analysis => {
    const map = (e: CutExpression): CutExpression => (variable === undefined ? e : relax(e, variable, false));
    const clauses = analysis.regions.map((r) => conjunction(r.cuts.map((c) => map(c.expression))));
    const union = clauses.reduce((left, right) => ({ kind: 'or', left, right, start: 0, end: 0 }));
    return {
      ...analysis,
      id: `${analysis.id}${suffix}`,
      steps: analysis.steps.map((s) => ({ name: s.name, cut: cutOf(map(s.cut.expression), s.cut) })),
      regions: [{ ...first, name: 'union of the signal regions', cuts: [cutOf(union, first.cuts[0]!)] }],
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
