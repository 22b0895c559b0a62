/**
 * The selection engine: streams reconstructed events once through every
 * analysis given (typically all analyses of one collider energy and one
 * detector profile). Analyses with identical object definitions share the
 * object building and the variable cache of each event; analyses with the
 * same isolation cone share the lepton isolation sums.
 */
import type { RecoEvent } from '../detector/recoEvent.js';
import { TamisError } from '../errors.js';
import type { Analysis } from './analysis.js';
import { EventVariables } from './eventVariables.js';
import { IsolationSums } from './isolationSums.js';
import { AnalysisObjects } from './objects.js';
import { weightedCount, type AnalysisResult, type CutBlame, type RegionOverlap, type SelectionResults } from './results.js';
import { AnalysisRunner } from './runner.js';

export interface SelectionOptions {
  /** Accumulate cut blame (default true). Off saves the evaluation of regions for events failing a step. */
  blame?: boolean;
  /** Event indices kept per overlapping region pair (default 5). */
  overlapExamples?: number;
}

export interface Selection {
  readonly analyses: readonly Analysis[];
  /** Counts one reconstructed event. `eventIndex` (default: events processed so far) labels overlap examples. */
  process(event: RecoEvent, eventIndex?: number): void;
  /** Number of events processed. */
  readonly events: number;
  /** Cut-flows, region counts, cut blame and overlaps so far. */
  results(): SelectionResults;
}

/**
 * Compiles the analyses into one selection.
 *
 * @example
 * const selection = createSelection(loadAnalyses(['analyses']));
 * for (const event of events) selection.process(event);
 * selection.results().analyses[0].regions[0].efficiency
 */
export function createSelection(analyses: readonly Analysis[], options: SelectionOptions = {}): Selection {
  const blame = options.blame ?? true;
  const overlapExamples = options.overlapExamples ?? 5;
  if (!Number.isInteger(overlapExamples) || overlapExamples < 0 || overlapExamples > 1000) {
    throw new TamisError('bad_input', `overlapExamples must be a whole number in [0, 1000], got ${overlapExamples}`);
  }
  const groups = new Map<string, EventVariables>();
  // Isolation sums depend only on the cone: computed once per event per cone in use.
  const isolation = new Map<number, IsolationSums>();
  const runners = analyses.map((analysis) => {
    const key = JSON.stringify(analysis.objects, (_k, v: unknown) => (v === Infinity ? 'Infinity' : v));
    let reader = groups.get(key);
    if (reader === undefined) {
      const cone = analysis.objects.isolationCone;
      let sums = isolation.get(cone);
      if (sums === undefined) {
        sums = new IsolationSums(cone);
        isolation.set(cone, sums);
      }
      reader = new EventVariables(new AnalysisObjects(analysis.objects, sums));
      groups.set(key, reader);
    }
    return new AnalysisRunner(analysis, reader, { blame, overlapExamples });
  });
  const readers = [...groups.values()];
  // Only cones that some analysis isolates with need their sums.
  const isolationInUse = [...isolation.values()].filter((sums) =>
    analyses.some((a) => a.objects.isolationCone * a.objects.isolationCone === sums.cone2 && (a.objects.electrons.maxRelativeIsolation !== Infinity || a.objects.muons.maxRelativeIsolation !== Infinity)),
  );
  let processed = 0;
  return {
    analyses,
    get events() {
      return processed;
    },
    process(event: RecoEvent, eventIndex?: number): void {
      for (let c = 0; c < isolationInUse.length; c++) isolationInUse[c]!.compute(event);
      for (let g = 0; g < readers.length; g++) {
        const reader = readers[g]!;
        reader.objects.build(event);
        reader.nextEvent();
      }
      const index = eventIndex ?? processed;
      for (let r = 0; r < runners.length; r++) runners[r]!.process(index);
      processed++;
    },
    results(): SelectionResults {
      return { events: processed, analyses: runners.map((r) => resultOf(r, blame, overlapExamples)) };
    },
  };
}

function resultOf(runner: AnalysisRunner, blame: boolean, examples: number): AnalysisResult {
  const a = runner.analysis;
  const W = runner.totalWeight;
  const W2 = runner.totalWeight2;
  const count = (arr: Float64Array, o: number) => weightedCount(arr[o]!, arr[o + 1]!, arr[o + 2]!, W, W2);
  const nSteps = a.steps.length;
  const nRegions = a.regions.length;
  const regions = a.regions.map((region, r) => {
    const own = count(runner.region, 3 * r);
    const blames: CutBlame[] = [];
    if (blame) {
      const entry = (kind: CutBlame['kind'], name: string, cut: string, arr: Float64Array, o: number): CutBlame => ({
        kind,
        name,
        cut,
        gained: count(arr, o),
        without: weightedCount(own.weight + arr[o]!, own.weight2 + arr[o + 1]!, own.events + arr[o + 2]!, W, W2),
      });
      a.steps.forEach((s, k) => blames.push(entry('step', s.name, s.cut.text, runner.stepBlame, 3 * (r * nSteps + k))));
      region.cuts.forEach((c, k) => blames.push(entry('region', c.text, c.text, runner.cutBlame, 3 * (runner.regionStart[r]! + k))));
    }
    return { name: region.name, cuts: region.cuts.map((c) => c.text), ...own, blame: blames };
  });
  const overlaps: RegionOverlap[] = [];
  for (let i = 0; i < nRegions; i++) {
    for (let j = i + 1; j < nRegions; j++) {
      const pair = i * nRegions + j;
      const events = runner.overlap[2 * pair + 1]!;
      if (events === 0) continue;
      const exampleEvents: number[] = [];
      for (let k = 0; k < Math.min(events, examples); k++) exampleEvents.push(runner.overlapExamples[pair * examples + k]!);
      overlaps.push({ first: a.regions[i]!.name, second: a.regions[j]!.name, events, weight: runner.overlap[2 * pair]!, exampleEvents });
    }
  }
  return {
    id: a.id,
    energyTev: a.energyTev,
    luminosityIfb: a.luminosityIfb,
    total: { weight: W, weight2: W2, events: runner.totalEvents },
    steps: a.steps.map((s, k) => ({ name: s.name, cut: s.cut.text, ...count(runner.step, 3 * k) })),
    regions,
    overlaps,
    regionsDisjoint: a.regionsDisjoint,
    disjointViolated: a.regionsDisjoint && overlaps.length > 0,
  };
}
