/**
 * Unweighted hard events: q qbar(') -> pair, by acceptance–rejection (von
 * Neumann's rejection method) against each channel's adapted VEGAS grid.
 *
 * Preparation (deterministic from the seed): every channel is integrated as in
 * `crossSection` (same streams, same grid, same number); then a search sample
 * of weights on the frozen grid sets the maximum weight w_max. Rather than the
 * single largest weight, whose value is set by a handful of points in a
 * corner the separable grid cannot follow, w_max is the "reduced maximum":
 * the smallest value for which the weights above it carry at most
 * OVERWEIGHT_TOLERANCE of the sample's total, sum (w - w_max)+ <= 1e-4 sum w
 * (common practice in event generators; it roughly doubles the acceptance).
 *
 * Generation: a channel is chosen with probability K sigma / sum K sigma, points
 * are drawn from its grid and kept with probability min(1, w / w_max). Points
 * with w > w_max are kept and counted; `overweightFraction` measures the share
 * of the cross section they under-represent, sum (w - w_max)+ / sum w over all
 * trials, which bounds the bias of the event distribution (about 1e-4).
 *
 * Event weight convention: every event carries `record.weight` = the total
 * cross section of the sample (pb, K-factors included), so the cross section
 * of any selection is sum(weights of selected events) / (number of events generated).
 */
import { TamisError } from '../errors.js';
import type { EventRecord } from './eventRecord.js';
import { STATUS_FINAL, STATUS_INCOMING } from './eventRecord.js';
import type { PartonDensity } from '../physics/partonDensity.js';
import { lesHouchesToyDensities } from '../physics/pdf/index.js';
import { RandomStream } from '../physics/random.js';
import { integrateChannel, STREAM_MAXIMUM_SEARCH, type ChannelIntegration } from './channelIntegration.js';
import { checkGeneratorOptions, crossSectionOf, DEFAULT_SEED, DEFAULT_TARGET_RELATIVE_ERROR, type CrossSectionResult, type CrossSectionSettings } from './crossSection.js';
import { POINT_COS_THETA, POINT_S, POINT_SCALE, POINT_X1, POINT_X2, POINT_Y, type HadronicIntegrand } from './hadronicIntegrand.js';
import type { Model } from './model/types.js';
import type { VegasGrid } from './vegas.js';

/** Largest share of the search sample's total weight allowed above w_max. */
export const OVERWEIGHT_TOLERANCE = 1e-4;
/** Points of the maximum-weight search per channel, on top of the integration's points. */
const MAXIMUM_SEARCH_CALLS = 100_000;
/** Give up after this many rejected points in a row (an efficiency below 1e-7 means a broken grid). */
const MAX_TRIALS_PER_EVENT = 10_000_000;
/** Colour tag of the annihilating quark line (LHE colour tags start above 500 by common practice). */
const COLOUR_TAG = 501;

export interface HardSamplerOptions {
  energyTeV: number;
  seed?: number;
  /** Parton densities (with their alpha_s); default the built-in LO toy densities. */
  pdf?: PartonDensity;
  scaleFactor?: number;
  targetRelativeError?: number;
}

/** What the sampler knows about one channel. */
export interface SamplerChannel {
  name: string;
  index: number;
  kFactor: number;
  /** K x sigma_LO and its MC error, pb. */
  sigmaPb: number;
  errorPb: number;
  /** w_max used for unweighting (pb per point). */
  maxWeight: number;
  /** Expected acceptance <w> / w_max. */
  unweightingEfficiency: number;
}

/** Running counts of one sampler instance (not shared between workers). */
export interface SamplerStatistics {
  trials: number;
  accepted: number;
  overweight: number;
  /** Sum of w over all trials and of (w - w_max) over overweight points, for `overweightFraction`. */
  weightSum: number;
  excessSum: number;
}

interface PreparedChannel {
  info: SamplerChannel;
  integrand: HadronicIntegrand;
  grid: VegasGrid;
}

export class HardSampler {
  readonly model: Model;
  readonly energyTeV: number;
  /** Total cross section (pb, K-factors included) and its MC error: the weight of every event. */
  readonly crossSectionPb: number;
  readonly errorPb: number;
  readonly channels: readonly SamplerChannel[];
  readonly statistics: SamplerStatistics = { trials: 0, accepted: 0, overweight: 0, weightSum: 0, excessSum: 0 };
  private readonly prepared: readonly PreparedChannel[];
  private readonly cumulative: Float64Array;
  private readonly sqrtS: number;
  private readonly alphaQed: number;
  private readonly u = new Float64Array(3);
  private readonly x = new Float64Array(3);
  private readonly bins = new Int32Array(3);

  private readonly integrations: readonly ChannelIntegration[];
  private readonly settings: CrossSectionSettings;
  private summary: CrossSectionResult | undefined;

  constructor(model: Model, energyTeV: number, prepared: readonly PreparedChannel[], integrations: readonly ChannelIntegration[], settings: CrossSectionSettings) {
    this.integrations = integrations;
    this.settings = settings;
    this.model = model;
    this.energyTeV = energyTeV;
    this.sqrtS = 1000 * energyTeV;
    this.alphaQed = model.couplings.alpha;
    this.prepared = prepared;
    this.channels = prepared.map((p) => p.info);
    this.crossSectionPb = prepared.reduce((s, p) => s + p.info.sigmaPb, 0);
    this.errorPb = Math.sqrt(prepared.reduce((s, p) => s + p.info.errorPb ** 2, 0));
    if (!(this.crossSectionPb > 0)) throw new TamisError('physics', `no production channel of model ${model.name} is open at ${energyTeV} TeV`);
    this.cumulative = new Float64Array(prepared.length);
    let sum = 0;
    prepared.forEach((p, i) => {
      sum += p.info.sigmaPb;
      this.cumulative[i] = sum / this.crossSectionPb;
    });
  }

  /**
   * The cross-section summary of this sample (channels, K-factors, scale band),
   * equal to what `crossSection` gives for the same model, energy and settings.
   * The scale band is integrated on first call.
   */
  crossSection(): CrossSectionResult {
    this.summary ??= crossSectionOf(this.model, this.energyTeV, this.integrations, this.settings);
    return this.summary;
  }

  /** Share of the cross section under-represented by overweight points so far (0 when none). */
  get overweightFraction(): number {
    return this.statistics.weightSum > 0 ? this.statistics.excessSum / this.statistics.weightSum : 0;
  }

  /**
   * Writes one unweighted hard event into `record` (cleared first): the two
   * incoming partons (status -1, beam 1 along +z first) and the pair (status 1,
   * mothers 0 and 1). Draws only from `rng`; allocates nothing.
   */
  fill(record: EventRecord, rng: RandomStream): void {
    const r = rng.uniform();
    let c = 0;
    while (c < this.cumulative.length - 1 && r >= this.cumulative[c]!) c++;
    const channel = this.prepared[c]!;
    const { integrand, grid } = channel;
    const maxWeight = channel.info.maxWeight;
    const stats = this.statistics;
    let w = 0;
    for (let trial = 0; ; trial++) {
      if (trial >= MAX_TRIALS_PER_EVENT) throw new TamisError('numeric', `channel ${channel.info.name}: no event accepted in ${MAX_TRIALS_PER_EVENT} trials`);
      this.u[0] = rng.uniform();
      this.u[1] = rng.uniform();
      this.u[2] = rng.uniform();
      const jacobian = grid.map(this.u, this.x, this.bins);
      w = integrand.evaluate(this.x) * jacobian;
      stats.trials++;
      if (!(w > 0)) continue;
      stats.weightSum += w;
      if (w > maxWeight) {
        stats.overweight++;
        stats.excessSum += w - maxWeight;
        break;
      }
      if (rng.uniform() * maxWeight < w) break;
    }
    stats.accepted++;
    // The sub-process, in proportion to its share of the point (the terms sum to termTotal).
    const pick = rng.uniform() * integrand.termTotal;
    let term = 0;
    let running = integrand.termWeight[0]!;
    while (term < integrand.termCount - 1 && pick >= running) running += integrand.termWeight[++term]!;
    this.writeEvent(record, channel, term, 2 * Math.PI * rng.uniform() - Math.PI);
  }

  private writeEvent(record: EventRecord, channel: PreparedChannel, term: number, phi: number): void {
    const integrand = channel.integrand;
    const ch = integrand.channel;
    const point = integrand.lastPoint;
    const s = point[POINT_S]!;
    const y = point[POINT_Y]!;
    const cosTheta = point[POINT_COS_THETA]!;
    const m1 = ch.firstMass;
    const m2 = ch.secondMass;
    const rootS = Math.sqrt(s);
    // Pair rest frame: p* = lambda^(1/2)(s, m1^2, m2^2) / (2 sqrt s) (PDG Review, "Kinematics").
    const e1 = (s + m1 * m1 - m2 * m2) / (2 * rootS);
    const e2 = rootS - e1;
    const p = Math.sqrt(Math.max(0, e1 * e1 - m1 * m1));
    const sinTheta = Math.sqrt(Math.max(0, 1 - cosTheta * cosTheta));
    const px = p * sinTheta * Math.cos(phi);
    const py = p * sinTheta * Math.sin(phi);
    const pz = p * cosTheta;
    // Longitudinal boost by rapidity y: E' = E cosh y + pz sinh y, pz' = pz cosh y + E sinh y.
    const coshY = Math.cosh(y);
    const sinhY = Math.sinh(y);
    const beamEnergy = this.sqrtS / 2;
    const e1In = point[POINT_X1]! * beamEnergy;
    const e2In = point[POINT_X2]! * beamEnergy;
    const parton1 = integrand.termParton1[term]!;
    const parton2 = integrand.termParton2[term]!;
    const conjugate = integrand.termConjugate[term]! < 0;
    const table = this.model.particles;
    const first = conjugate ? table.conjugate(ch.first) : ch.first;
    const second = conjugate ? table.conjugate(ch.second) : ch.second;
    record.clear();
    const i1 = record.add(parton1, STATUS_INCOMING, -1, -1, 0, 0, e1In, e1In, 0);
    const i2 = record.add(parton2, STATUS_INCOMING, -1, -1, 0, 0, -e2In, e2In, 0);
    // Quarks carry the colour tag, antiquarks the anticolour tag (LHE, hep-ph/0609017).
    if (parton1 > 0) record.colour1[i1] = COLOUR_TAG;
    else record.colour2[i1] = COLOUR_TAG;
    if (parton2 > 0) record.colour1[i2] = COLOUR_TAG;
    else record.colour2[i2] = COLOUR_TAG;
    record.add(first, STATUS_FINAL, i1, i2, px, py, pz * coshY + e1 * sinhY, e1 * coshY + pz * sinhY, m1);
    record.add(second, STATUS_FINAL, i1, i2, -px, -py, -pz * coshY + e2 * sinhY, e2 * coshY - pz * sinhY, m2);
    record.weight = this.crossSectionPb;
    record.scale = point[POINT_SCALE]!;
    record.alphaQed = this.alphaQed;
    record.alphaQcd = integrand.alphaS(point[POINT_SCALE]!);
    record.processId = ch.index;
  }
}

/**
 * Integrates every channel of `model` and prepares the unweighting. Deterministic
 * from `seed`: two workers preparing the same model get the same sampler.
 */
export function prepareHardSampler(model: Model, options: HardSamplerOptions): HardSampler {
  const seed = options.seed ?? DEFAULT_SEED;
  const scaleFactor = options.scaleFactor ?? 1;
  const targetRelativeError = options.targetRelativeError ?? DEFAULT_TARGET_RELATIVE_ERROR;
  checkGeneratorOptions(options.energyTeV, seed, scaleFactor, targetRelativeError);
  const settings: CrossSectionSettings = { pdf: options.pdf ?? lesHouchesToyDensities(), scaleFactor, seed, targetRelativeError };
  const base = { sqrtS: 1000 * options.energyTeV, ...settings };
  const prepared: PreparedChannel[] = [];
  const integrations: ChannelIntegration[] = [];
  for (const channel of model.channels) {
    const integration: ChannelIntegration = integrateChannel(channel, base);
    integrations.push(integration);
    if (integration.grid === null || !(integration.result.integral > 0)) continue;
    const weights = sampleWeights(integration.integrand, integration.grid, MAXIMUM_SEARCH_CALLS, RandomStream.forStream(seed, STREAM_MAXIMUM_SEARCH, channel.index));
    const maxWeight = reducedMaximum(weights, OVERWEIGHT_TOLERANCE);
    const k = channel.kFactor;
    prepared.push({
      info: {
        name: channel.name,
        index: channel.index,
        kFactor: k,
        sigmaPb: k * integration.result.integral,
        errorPb: k * integration.result.error,
        maxWeight,
        unweightingEfficiency: integration.result.integral / maxWeight,
      },
      integrand: integration.integrand,
      grid: integration.grid,
    });
  }
  return new HardSampler(model, options.energyTeV, prepared, integrations, settings);
}

/** Weights f J of `calls` points drawn from a frozen grid. */
function sampleWeights(integrand: HadronicIntegrand, grid: VegasGrid, calls: number, rng: RandomStream): Float64Array {
  const weights = new Float64Array(calls);
  const u = new Float64Array(3);
  const x = new Float64Array(3);
  const bins = new Int32Array(3);
  for (let i = 0; i < calls; i++) {
    u[0] = rng.uniform();
    u[1] = rng.uniform();
    u[2] = rng.uniform();
    const jacobian = grid.map(u, x, bins);
    weights[i] = integrand.evaluate(x) * jacobian;
  }
  return weights;
}

/**
 * The smallest w_max with sum over w_i > w_max of (w_i - w_max) <= tolerance x sum w_i
 * (`weights` is sorted in place). With tolerance 0, or when no smaller value
 * is found, it is the largest weight.
 *
 * @example
 * reducedMaximum(Float64Array.of(1, 1, 1, 1, 6), 0.1) // 5: the excess 6 - 5 = 1 is 10% of the total 10
 */
export function reducedMaximum(weights: Float64Array, tolerance: number): number {
  weights.sort();
  let total = 0;
  for (let i = 0; i < weights.length; i++) total += weights[i]!;
  const allowed = tolerance * total;
  // Walk down from the largest weight: with the k largest weights above w, the excess is
  // (sum of them) - k w; find where it first exceeds the allowance.
  let sumAbove = 0;
  for (let k = 1; k < weights.length; k++) {
    sumAbove += weights[weights.length - k]!;
    const next = weights[weights.length - k - 1]!;
    if (sumAbove - k * next > allowed) return (sumAbove - allowed) / k;
  }
  return weights[weights.length - 1]!;
}
