/**
 * The fixed description of several disjoint counting regions and their
 * nuisance parameters, in flat typed arrays: observed counts, signal at
 * mu = 1, backgrounds with their uncertainty responses (`constraint.ts`), and
 * correlation groups (one background nuisance parameter per group, moving
 * every background of the group together; one signal nuisance per region).
 */
import { TamisError } from '../errors.js';
import {
  backgroundAt, backgroundKind, FIXED_BACKGROUND, LOG_NORMAL_BACKGROUND, logKappa, thetaLowerBound, type BackgroundKind,
} from './constraint.js';
import type { UncertaintyModel } from './types.js';

/** One region of the model; `group` is an index 0..groupCount-1. */
export interface ModelRegion {
  observed: number;
  background: number;
  backgroundUncertainty: number;
  /** Signal at mu = 1. */
  signal: number;
  /** Relative signal uncertainty. */
  signalUncertainty: number;
  group: number;
}

/** The fixed description of a set of regions, in flat typed arrays. */
export class CountingModel {
  readonly regionCount: number;
  readonly groupCount: number;
  readonly observed: Float64Array;
  readonly signal: Float64Array;
  readonly background: Float64Array;
  readonly backgroundUncertainty: Float64Array;
  readonly kind: Uint8Array;
  readonly lnKappa: Float64Array;
  /** ln(1 + r) of each region's log-normal signal response (0 without signal uncertainty). */
  readonly lnSignalFactor: Float64Array;
  readonly group: Int32Array;
  /** Regions of group g are groupRegions[groupStart[g] .. groupStart[g + 1]). */
  readonly groupStart: Int32Array;
  readonly groupRegions: Int32Array;
  readonly groupLowerBound: Float64Array;
  /** 1 when some region of the group has a background uncertainty. */
  readonly groupFree: Uint8Array;
  readonly uncertaintyModel: UncertaintyModel;

  constructor(regions: readonly ModelRegion[], uncertaintyModel: UncertaintyModel) {
    const count = regions.length;
    this.regionCount = count;
    this.uncertaintyModel = uncertaintyModel;
    this.observed = new Float64Array(count);
    this.signal = new Float64Array(count);
    this.background = new Float64Array(count);
    this.backgroundUncertainty = new Float64Array(count);
    this.kind = new Uint8Array(count);
    this.lnKappa = new Float64Array(count);
    this.lnSignalFactor = new Float64Array(count);
    this.group = new Int32Array(count);
    let groupCount = 0;
    regions.forEach((r, i) => {
      this.observed[i] = r.observed;
      this.signal[i] = r.signal;
      this.background[i] = r.background;
      this.backgroundUncertainty[i] = r.backgroundUncertainty;
      const kind = backgroundKind(r.background, r.backgroundUncertainty, uncertaintyModel);
      this.kind[i] = kind;
      this.lnKappa[i] = kind === LOG_NORMAL_BACKGROUND ? logKappa(r.background, r.backgroundUncertainty) : 0;
      this.lnSignalFactor[i] = Math.log1p(r.signalUncertainty);
      if (!Number.isInteger(r.group) || r.group < 0) throw new TamisError('internal', `bad group index ${r.group}`);
      this.group[i] = r.group;
      groupCount = Math.max(groupCount, r.group + 1);
    });
    this.groupCount = groupCount;
    this.groupStart = new Int32Array(groupCount + 1);
    for (let i = 0; i < count; i++) this.groupStart[this.group[i] + 1] += 1;
    for (let g = 0; g < groupCount; g++) this.groupStart[g + 1] += this.groupStart[g];
    this.groupRegions = new Int32Array(count);
    const fill = this.groupStart.slice(0, groupCount);
    for (let i = 0; i < count; i++) this.groupRegions[fill[this.group[i]]++] = i;
    this.groupLowerBound = new Float64Array(groupCount).fill(Number.NEGATIVE_INFINITY);
    this.groupFree = new Uint8Array(groupCount);
    for (let i = 0; i < count; i++) {
      const g = this.group[i];
      const kind = this.kind[i] as BackgroundKind;
      if (kind !== FIXED_BACKGROUND) this.groupFree[g] = 1;
      this.groupLowerBound[g] = Math.max(this.groupLowerBound[g], thetaLowerBound(kind, this.background[i], this.backgroundUncertainty[i]));
    }
  }

  /** B_i(theta). */
  backgroundOf(i: number, theta: number): number {
    return backgroundAt(this.kind[i] as BackgroundKind, this.background[i], this.backgroundUncertainty[i], this.lnKappa[i], theta);
  }
}
