/**
 * From an analysis's merged selection results and the model's cross section
 * to its outcome: per-region efficiencies, expected signal, N95 and sigma95
 * (observed and expected with bands), r, the best-expected region, the
 * combination of disjoint regions, the verdict and what each cut costs.
 *
 * Verdict rule (the best-expected-region rule, common practice in
 * reinterpretation): the region with the strongest expected limit is chosen
 * without looking at the data, and the model is excluded at the chosen CL when
 * that region's observed r = sigma_model / sigma95 is at least 1.
 */
import { RandomStream } from '../physics/random.js';
import type { Analysis } from '../selection/analysis.js';
import { weightedCount, type AnalysisResult } from '../selection/results.js';
import { analysisLimits, type LimitMethod, type RecastRegion, type UncertaintyModel } from '../stats/index.js';
import { streamIdOf } from './eventChunks.js';
import type { AnalysisOutcome, CutCost, RegionOutcome, Verdict } from './types.js';

/** Stream tag of the pseudo-experiments of the limits ("LIMS"). */
export const STREAM_LIMITS = 0x4c494d53;

export interface LimitSettings {
  cl: number;
  method: LimitMethod;
  /** Method of the combination of an analysis's regions. @default `method` */
  combinationMethod?: LimitMethod;
  uncertaintyModel: UncertaintyModel;
  seed: number;
  pointId: readonly number[];
}

/** Limit settings with tamis's defaults: 95% CL, `auto` method, log-normal background uncertainty. */
export function limitSettingsOf(options: { cl?: number; method?: LimitMethod; combinationMethod?: LimitMethod; uncertaintyModel?: UncertaintyModel; seed: number; pointId?: readonly number[] }): LimitSettings {
  return {
    cl: options.cl ?? 0.95,
    method: options.method ?? 'auto',
    ...(options.combinationMethod === undefined ? {} : { combinationMethod: options.combinationMethod }),
    uncertaintyModel: options.uncertaintyModel ?? 'lognormal',
    seed: options.seed,
    pointId: [...(options.pointId ?? [])],
  };
}

export function analysisOutcome(analysis: Analysis, selected: AnalysisResult, crossSectionPb: number, settings: LimitSettings): AnalysisOutcome {
  const groupOf = new Map<string, string>();
  for (const group of analysis.correlationGroups) for (const region of group.regions) groupOf.set(region, group.name);
  const recastRegions: RecastRegion[] = analysis.regions.map((region, i) => {
    const counts = selected.regions[i]!;
    const r: RecastRegion = {
      name: region.name,
      observed: region.observed,
      background: region.background,
      backgroundUncertainty: region.backgroundUncertainty,
      efficiency: counts.efficiency,
      efficiencyError: counts.efficiencyError,
    };
    const group = groupOf.get(region.name);
    if (group !== undefined) r.group = group;
    if (region.n95Observed !== undefined) r.publishedN95 = region.n95Observed;
    if (region.n95Expected !== undefined) r.publishedExpectedN95 = region.n95Expected;
    return r;
  });
  const limits = analysisLimits(
    recastRegions,
    {
      luminosity: analysis.luminosityIfb,
      crossSection: crossSectionPb,
      combine: analysis.regionsDisjoint,
      ...(settings.combinationMethod === undefined ? {} : { combinationMethod: settings.combinationMethod }),
    },
    {
      cl: settings.cl,
      method: settings.method,
      uncertaintyModel: settings.uncertaintyModel,
      rng: RandomStream.forStream(settings.seed, ...settings.pointId, STREAM_LIMITS, streamIdOf(analysis.id)),
    },
  );
  const regions: RegionOutcome[] = analysis.regions.map((region, i) => {
    const counts = selected.regions[i]!;
    const l = limits.regions[i]!;
    const out: RegionOutcome = {
      name: region.name,
      observed: region.observed,
      background: region.background,
      backgroundUncertainty: region.backgroundUncertainty,
      efficiency: counts.efficiency,
      efficiencyError: counts.efficiencyError,
      selectedEvents: counts.events,
      signal: l.signal,
      n95Observed: l.n95.observed,
      n95Expected: l.n95.expected,
      sigma95ObservedPb: l.sigma95.observed,
      sigma95ExpectedPb: l.sigma95.expected,
      rObserved: l.sigma95.rObserved,
      rExpected: l.sigma95.rExpected,
      method: l.n95.method,
    };
    if (l.published?.observed) {
      out.publishedN95Observed = l.published.observed.published;
      out.ratioToPublishedObserved = l.published.observed.ratio;
    }
    if (l.published?.expected) {
      out.publishedN95Expected = l.published.expected.published;
      out.ratioToPublishedExpected = l.published.expected.ratio;
    }
    return out;
  });
  const best = limits.bestRegion >= 0 ? regions[limits.bestRegion]! : null;
  const verdict: Verdict = best === null ? 'no sensitivity' : best.rObserved >= 1 ? 'excluded' : 'allowed';
  // Cut costs of the best region, or of the most efficient region when none is sensitive.
  let focus = limits.bestRegion;
  if (focus < 0) focus = mostBlamedRegion(selected);
  const inRegions = signalRegionEfficiency(selected);
  return {
    id: analysis.id,
    summary: analysis.summary,
    file: analysis.file,
    invented: analysis.invented,
    energyTeV: analysis.energyTev,
    luminosityIfb: analysis.luminosityIfb,
    detector: analysis.detectorFile.replace(/^.*[\\/]/, ''),
    events: selected.total.events,
    signalRegionEfficiency: inRegions,
    steps: selected.steps.map((s) => ({ name: s.name, cut: s.cut, efficiency: s.efficiency, efficiencyError: s.efficiencyError, selectedEvents: s.events })),
    regions,
    bestRegion: best?.name ?? null,
    combined: limits.combined
      ? {
          sigma95ObservedPb: limits.combined.sigma95.observed,
          sigma95ExpectedPb: limits.combined.sigma95.expected,
          rObserved: limits.combined.sigma95.rObserved,
          rExpected: limits.combined.sigma95.rExpected,
        }
      : null,
    verdict,
    cutCosts: focus >= 0 ? cutCostsOf(selected, focus) : [],
    requirementCosts: [],
    overlaps: selected.overlaps.map((o) => ({ first: o.first, second: o.second, events: o.events, exampleEvents: o.exampleEvents })),
  };
}

/** Efficiency of the union of disjoint regions (exact weighted binomial error), or of the best single region. */
export function signalRegionEfficiency(selected: AnalysisResult): { value: number; error: number } {
  if (selected.regionsDisjoint && !selected.disjointViolated) {
    let weight = 0;
    let weight2 = 0;
    let events = 0;
    for (const r of selected.regions) {
      weight += r.weight;
      weight2 += r.weight2;
      events += r.events;
    }
    const union = weightedCount(weight, weight2, events, selected.total.weight, selected.total.weight2);
    return { value: union.efficiency, error: union.efficiencyError };
  }
  let best = { value: 0, error: 0 };
  for (const r of selected.regions) if (r.efficiency > best.value) best = { value: r.efficiency, error: r.efficiencyError };
  return best;
}

/** The region whose single most expensive cut recovers the most signal (for analyses that select nothing). */
function mostBlamedRegion(selected: AnalysisResult): number {
  let bestIndex = -1;
  let bestWithout = 0;
  selected.regions.forEach((region, i) => {
    for (const b of region.blame) {
      if (b.without.efficiency > bestWithout) {
        bestWithout = b.without.efficiency;
        bestIndex = i;
      }
    }
  });
  return bestIndex;
}

/** Costs of every cut of one region, costliest first (ties keep the file's order). */
export function cutCostsOf(selected: AnalysisResult, regionIndex: number): CutCost[] {
  const region = selected.regions[regionIndex]!;
  const costs = region.blame.map((b): CutCost => {
    const gainFactor = region.efficiency > 0 ? b.without.efficiency / region.efficiency : b.without.efficiency > 0 ? Infinity : 1;
    return { kind: b.kind, name: b.name, cut: b.cut, efficiencyWithout: b.without.efficiency, gainFactor };
  });
  return costs
    .map((c, i) => ({ c, i }))
    .sort((a, b) => b.c.efficiencyWithout - a.c.efficiencyWithout || a.i - b.i)
    .map((x) => x.c);
}
