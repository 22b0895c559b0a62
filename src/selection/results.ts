/**
 * The results of a selection run: cut-flow, region counts with Monte Carlo
 * errors, cut blame and region overlaps, per analysis. Results hold sums
 * (of weights, of squared weights, of events), so runs over separate chunks
 * of events merge exactly (`mergeSelectionResults`).
 */
import { TamisError } from '../errors.js';

/** A weighted count and what follows from it. */
export interface WeightedCount {
  /** Sum of event weights. */
  weight: number;
  /** Sum of squared event weights. */
  weight2: number;
  /** Number of events, unweighted. */
  events: number;
  /** Monte Carlo error of `weight`: sqrt(weight2). */
  error: number;
  /** weight / (total weight of all processed events). */
  efficiency: number;
  /**
   * Monte Carlo error of the efficiency for weighted events,
   * sqrt((1 - eff)^2 sum_pass w^2 + eff^2 sum_fail w^2) / W (common practice;
   * for unit weights it is the binomial sqrt(eff (1 - eff) / N)).
   */
  efficiencyError: number;
}

export interface StepResult extends WeightedCount {
  name: string;
  cut: string;
}

/** What one region would gain if one cut were dropped. */
export interface CutBlame {
  /** `step`: a selection step; `region`: one of the region's own cuts. */
  kind: 'step' | 'region';
  /** Step name, or the region cut's text. */
  name: string;
  cut: string;
  /** Events passing everything but this cut, minus the region's count: the signal the cut costs. */
  gained: WeightedCount;
  /** The region's count with this cut dropped. */
  without: WeightedCount;
}

export interface RegionResult extends WeightedCount {
  name: string;
  cuts: string[];
  /** One entry per step and per region cut, in order (empty when blame was switched off). */
  blame: CutBlame[];
}

/** Two regions that selected the same events. */
export interface RegionOverlap {
  first: string;
  second: string;
  events: number;
  weight: number;
  /** Indices of some shared events (the smallest ones seen), for finding them again. */
  exampleEvents: number[];
}

export interface AnalysisResult {
  id: string;
  energyTev: number;
  luminosityIfb: number;
  /** All processed events. */
  total: { weight: number; weight2: number; events: number };
  steps: StepResult[];
  regions: RegionResult[];
  overlaps: RegionOverlap[];
  /** Whether the analysis file declares its regions disjoint. */
  regionsDisjoint: boolean;
  /** True when regions declared disjoint shared an event. */
  disjointViolated: boolean;
}

export interface SelectionResults {
  events: number;
  analyses: AnalysisResult[];
}

/** Builds a `WeightedCount` from sums, given the totals of all processed events. */
export function weightedCount(weight: number, weight2: number, events: number, totalWeight: number, totalWeight2: number): WeightedCount {
  const efficiency = totalWeight !== 0 ? weight / totalWeight : 0;
  const failWeight2 = Math.max(0, totalWeight2 - weight2);
  const variance = (1 - efficiency) * (1 - efficiency) * weight2 + efficiency * efficiency * failWeight2;
  const efficiencyError = totalWeight !== 0 ? Math.sqrt(Math.max(0, variance)) / Math.abs(totalWeight) : 0;
  return { weight, weight2, events, error: Math.sqrt(weight2), efficiency, efficiencyError };
}

function addCounts(a: WeightedCount, b: WeightedCount, totalWeight: number, totalWeight2: number): WeightedCount {
  return weightedCount(a.weight + b.weight, a.weight2 + b.weight2, a.events + b.events, totalWeight, totalWeight2);
}

function mergeAnalysis(a: AnalysisResult, b: AnalysisResult, examples: number): AnalysisResult {
  const total = { weight: a.total.weight + b.total.weight, weight2: a.total.weight2 + b.total.weight2, events: a.total.events + b.total.events };
  const add = (x: WeightedCount, y: WeightedCount) => addCounts(x, y, total.weight, total.weight2);
  const overlaps = new Map<string, RegionOverlap>();
  for (const o of [...a.overlaps, ...b.overlaps]) {
    const key = `${o.first}\u0000${o.second}`;
    const seen = overlaps.get(key);
    if (seen === undefined) overlaps.set(key, { ...o, exampleEvents: [...o.exampleEvents] });
    else {
      seen.events += o.events;
      seen.weight += o.weight;
      seen.exampleEvents = [...new Set([...seen.exampleEvents, ...o.exampleEvents])].sort((x, y) => x - y).slice(0, examples);
    }
  }
  const regionOrder = new Map(a.regions.map((r, i) => [r.name, i]));
  const sortedOverlaps = [...overlaps.values()].sort((x, y) => regionOrder.get(x.first)! - regionOrder.get(y.first)! || regionOrder.get(x.second)! - regionOrder.get(y.second)!);
  return {
    ...a,
    total,
    steps: a.steps.map((s, i) => ({ name: s.name, cut: s.cut, ...add(s, b.steps[i]!) })),
    regions: a.regions.map((r, i) => {
      const other = b.regions[i]!;
      return {
        name: r.name,
        cuts: r.cuts,
        ...add(r, other),
        blame: r.blame.map((bl, k) => ({ kind: bl.kind, name: bl.name, cut: bl.cut, gained: add(bl.gained, other.blame[k]!.gained), without: add(bl.without, other.blame[k]!.without) })),
      };
    }),
    overlaps: sortedOverlaps,
    disjointViolated: a.disjointViolated || b.disjointViolated,
  };
}

/**
 * Adds the results of runs over separate chunks of events (same analyses, in
 * the same order): counts add, efficiencies and errors are recomputed.
 * Example events of overlaps must use global event indices.
 */
export function mergeSelectionResults(parts: readonly SelectionResults[], overlapExamples = 5): SelectionResults {
  if (parts.length === 0) return { events: 0, analyses: [] };
  let merged = parts[0]!;
  for (let p = 1; p < parts.length; p++) {
    const next = parts[p]!;
    const ids = (r: SelectionResults) => r.analyses.map((a) => `${a.id}:${a.regions.length}:${a.steps.length}`).join(',');
    if (ids(next) !== ids(merged)) {
      throw new TamisError('bad_input', `cannot merge selection results of different analyses: [${merged.analyses.map((a) => a.id).join(', ')}] and [${next.analyses.map((a) => a.id).join(', ')}]`);
    }
    merged = { events: merged.events + next.events, analyses: merged.analyses.map((a, i) => mergeAnalysis(a, next.analyses[i]!, overlapExamples)) };
  }
  return merged;
}
