/**
 * One analysis applied event by event: its compiled cuts, its accumulators
 * (cut-flow, regions, cut blame, overlaps) in typed arrays, no allocation
 * per event.
 *
 * Cut blame needs, for every region, the events that fail exactly one of its
 * cuts (the steps and the region's own cuts together): such an event would
 * enter the region if that one cut were dropped. An event failing two or
 * more cuts cannot be blamed on any single one, so evaluation stops at the
 * second failure.
 */
import type { Analysis } from './analysis.js';
import type { EventVariables } from './eventVariables.js';
import { printExpression } from './expression/ast.js';
import { compileExpression, type CompiledCut } from './expression/compile.js';
import { variableSlot } from './variables.js';

export class AnalysisRunner {
  readonly analysis: Analysis;
  private readonly reader: EventVariables;
  private readonly compiled: CompiledCut[] = [];
  private readonly cutStamp: Uint32Array;
  private readonly cutValue: Uint8Array;
  private epoch = 0;
  readonly stepCut: Int32Array;
  /** Region r's cuts are regionCuts[regionStart[r] .. regionStart[r + 1]). */
  readonly regionStart: Int32Array;
  readonly regionCuts: Int32Array;
  private readonly blame: boolean;
  private readonly examplesPerPair: number;

  // Accumulators.
  totalWeight = 0;
  totalWeight2 = 0;
  totalEvents = 0;
  readonly step: Float64Array; // [3 * s]: weight, weight2, events
  readonly region: Float64Array; // [3 * r]
  /** Blame of step s for region r at [3 * (r * nSteps + s)]. */
  readonly stepBlame: Float64Array;
  /** Blame of region cut k (flat index into regionCuts) at [3 * k]. */
  readonly cutBlame: Float64Array;
  /** Overlap of regions a < b at [2 * (a * nRegions + b)]: weight, events. */
  readonly overlap: Float64Array;
  /** Example event indices of pair (a, b) at [(a * nRegions + b) * examples + j]. */
  readonly overlapExamples: Float64Array;
  private readonly passed: Int32Array;

  constructor(analysis: Analysis, reader: EventVariables, options: { blame: boolean; overlapExamples: number }) {
    this.analysis = analysis;
    this.reader = reader;
    this.blame = options.blame;
    this.examplesPerPair = options.overlapExamples;
    const index = new Map<string, number>();
    const cutIndex = (cut: Analysis['steps'][number]['cut']): number => {
      const key = printExpression(cut.expression);
      let i = index.get(key);
      if (i === undefined) {
        i = this.compiled.length;
        index.set(key, i);
        this.compiled.push(compileExpression(cut.expression, variableSlot));
      }
      return i;
    };
    this.stepCut = Int32Array.from(analysis.steps, (s) => cutIndex(s.cut));
    const nRegions = analysis.regions.length;
    this.regionStart = new Int32Array(nRegions + 1);
    const flat: number[] = [];
    analysis.regions.forEach((r, i) => {
      this.regionStart[i] = flat.length;
      for (const c of r.cuts) flat.push(cutIndex(c));
    });
    this.regionStart[nRegions] = flat.length;
    this.regionCuts = Int32Array.from(flat);
    this.cutStamp = new Uint32Array(this.compiled.length);
    this.cutValue = new Uint8Array(this.compiled.length);
    const nSteps = analysis.steps.length;
    this.step = new Float64Array(3 * nSteps);
    this.region = new Float64Array(3 * nRegions);
    this.stepBlame = new Float64Array(3 * nRegions * nSteps);
    this.cutBlame = new Float64Array(3 * flat.length);
    this.overlap = new Float64Array(2 * nRegions * nRegions);
    this.overlapExamples = new Float64Array(nRegions * nRegions * Math.max(0, this.examplesPerPair)).fill(-1);
    this.passed = new Int32Array(nRegions);
  }

  /** Whether cut `c` passes in the current event (each distinct cut is evaluated at most once per event). */
  private pass(c: number): boolean {
    if (this.cutStamp[c] === this.epoch) return this.cutValue[c] === 1;
    const value = this.compiled[c]!(this.reader);
    this.cutStamp[c] = this.epoch;
    this.cutValue[c] = value ? 1 : 0;
    return value;
  }

  /** Counts the current event (its objects are already built) with index `eventIndex`. */
  process(eventIndex: number): void {
    this.epoch = (this.epoch + 1) >>> 0;
    if (this.epoch === 0) {
      this.cutStamp.fill(0);
      this.epoch = 1;
    }
    const w = this.reader.objects.weight;
    const w2 = w * w;
    this.totalWeight += w;
    this.totalWeight2 += w2;
    this.totalEvents++;

    const nSteps = this.stepCut.length;
    let failedStep = -1;
    for (let s = 0; s < nSteps; s++) {
      if (this.pass(this.stepCut[s]!)) {
        if (failedStep < 0) {
          this.step[3 * s] += w;
          this.step[3 * s + 1] += w2;
          this.step[3 * s + 2] += 1;
        }
      } else if (failedStep < 0) {
        if (!this.blame) return;
        failedStep = s;
      } else {
        return; // two steps fail: no region can be blamed on a single cut
      }
    }
    if (failedStep >= 0) {
      this.blameStep(failedStep, w, w2);
      return;
    }
    this.countRegions(w, w2, eventIndex);
  }

  private countRegions(w: number, w2: number, eventIndex: number): void {
    const nRegions = this.regionStart.length - 1;
    let nPassed = 0;
    for (let r = 0; r < nRegions; r++) {
      const end = this.regionStart[r + 1]!;
      let failed = -1;
      let k = this.regionStart[r]!;
      for (; k < end; k++) {
        if (this.pass(this.regionCuts[k]!)) continue;
        if (failed >= 0 || !this.blame) break;
        failed = k;
      }
      if (k < end) continue; // stopped early: two failures, or one without blame
      if (failed < 0) {
        this.region[3 * r] += w;
        this.region[3 * r + 1] += w2;
        this.region[3 * r + 2] += 1;
        this.passed[nPassed++] = r;
      } else {
        this.cutBlame[3 * failed] += w;
        this.cutBlame[3 * failed + 1] += w2;
        this.cutBlame[3 * failed + 2] += 1;
      }
    }
    if (nPassed > 1) this.countOverlaps(nPassed, w, eventIndex);
  }

  private blameStep(s: number, w: number, w2: number): void {
    const nRegions = this.regionStart.length - 1;
    const nSteps = this.stepCut.length;
    for (let r = 0; r < nRegions; r++) {
      const end = this.regionStart[r + 1]!;
      let k = this.regionStart[r]!;
      while (k < end && this.pass(this.regionCuts[k]!)) k++;
      if (k < end) continue;
      const o = 3 * (r * nSteps + s);
      this.stepBlame[o] += w;
      this.stepBlame[o + 1] += w2;
      this.stepBlame[o + 2] += 1;
    }
  }

  private countOverlaps(nPassed: number, w: number, eventIndex: number): void {
    const nRegions = this.regionStart.length - 1;
    const per = this.examplesPerPair;
    for (let i = 0; i < nPassed; i++) {
      for (let j = i + 1; j < nPassed; j++) {
        const pair = this.passed[i]! * nRegions + this.passed[j]!;
        const seen = this.overlap[2 * pair + 1]!;
        this.overlap[2 * pair] += w;
        this.overlap[2 * pair + 1] = seen + 1;
        if (seen < per) this.overlapExamples[pair * per + seen] = eventIndex;
      }
    }
  }
}
