/**
 * Hadronic cross sections of a model's production channels at a proton–proton
 * collider: VEGAS integration per channel with its Monte Carlo error, the
 * K-factor of each channel, and a scale band.
 *
 * Scales: mu_F = mu_R = the channel's scale choice (default the average mass of
 * the produced pair; the pair mass sqrt(s) for lepton pairs) times
 * `scaleFactor`. At leading order these electroweak processes contain no
 * alpha_s, so mu_R drops out and the band [x0.5, x2] measures the
 * factorisation-scale dependence of the parton densities alone. The band is
 * the [min, max] of the three totals (central, x0.5, x2), computed on the same
 * points as the central value, and is scaled by the K-factors like the central value.
 */
import { TamisError } from '../errors.js';
import type { PartonDensity } from '../physics/partonDensity.js';
import { lesHouchesToyDensities } from '../physics/pdf/index.js';
import { integrateAtScale, integrateChannel, type ChannelIntegration, type ChannelIntegrationOptions } from './channelIntegration.js';
import type { Model, ProductionChannel } from './model/types.js';

/** Collider energies tamis is commonly run at (TeV); any other positive value works too. */
export const STANDARD_ENERGIES_TEV = [7, 8, 13, 13.6, 14] as const;
export const DEFAULT_TARGET_RELATIVE_ERROR = 0.005;
export const DEFAULT_SEED = 1;

export interface CrossSectionOptions {
  /** sqrt(S) in TeV, in (0, 100]. */
  energyTeV: number;
  /** Parton densities (with their alpha_s); default the built-in LO toy densities. */
  pdf?: PartonDensity;
  /** Multiplies the default scale choice (default 1). */
  scaleFactor?: number;
  /** Seed of the integration streams (default 1). */
  seed?: number;
  /** Target relative MC error of each channel (default 0.005). */
  targetRelativeError?: number;
}

export interface ChannelCrossSection {
  name: string;
  index: number;
  kFactor: number;
  /** K x sigma_LO, pb. */
  sigmaPb: number;
  /** K x MC error, pb. */
  errorPb: number;
  /** Leading-order cross section, pb. */
  sigmaLoPb: number;
  /** K x [min, max] of sigma at scale factors x1, x0.5 and x2, pb. */
  scaleBandPb: [number, number];
  /** K x sigma at scale factors x0.5 and x2, pb. */
  sigmaHalfScalePb: number;
  sigmaDoubleScalePb: number;
  /** The central scale mu_F = mu_R: a number in GeV, or "pair mass" for the dynamic choice. */
  scale: string;
  /** Integrand evaluations of the central value. */
  calls: number;
  /** chi^2 per degree of freedom of the production iterations (about 1 when healthy). */
  chi2PerDof: number;
  /** False when the pair cannot be produced at this energy. */
  open: boolean;
}

export interface CrossSectionResult {
  model: string;
  energyTeV: number;
  /** Sum over channels of K x sigma_LO, pb. */
  sigmaPb: number;
  /** MC error of the sum (channels independent), pb. */
  errorPb: number;
  scaleBandPb: [number, number];
  channels: ChannelCrossSection[];
  /** K-factor per channel name. */
  kFactors: Record<string, number>;
  pdfName: string;
  scaleFactor: number;
  seed: number;
  targetRelativeError: number;
  /** True when every open channel reached the target relative error. */
  reachedTarget: boolean;
}

/** The central scale of a channel for reports: "300 GeV" or "pair mass" (times the factor when not 1). */
function describeScale(channel: ProductionChannel, factor: number): string {
  const times = factor === 1 ? '' : `${factor} x `;
  if (channel.scale.kind === 'pair_mass') return `${times}pair mass`;
  const value = channel.scale.kind === 'fixed' ? channel.scale.value : (channel.firstMass + channel.secondMass) / 2;
  return `${Number((factor * value).toPrecision(6))} GeV`;
}

/** Checks the common options; throws `bad_input` TamisErrors naming the option. */
export function checkGeneratorOptions(energyTeV: number, seed: number, scaleFactor: number, target: number): void {
  if (!(Number.isFinite(energyTeV) && energyTeV > 0 && energyTeV <= 100)) throw new TamisError('bad_input', `energy must be in (0, 100] TeV, got ${energyTeV}`, { key: 'energy' });
  if (!(Number.isInteger(seed) && seed >= 0 && seed <= Number.MAX_SAFE_INTEGER)) throw new TamisError('bad_input', `seed must be a whole number >= 0, got ${seed}`, { key: 'seed' });
  if (!(scaleFactor >= 0.1 && scaleFactor <= 10)) throw new TamisError('bad_input', `scale factor must be in [0.1, 10], got ${scaleFactor}`, { key: 'scale' });
  if (!(target >= 1e-5 && target <= 0.5)) throw new TamisError('bad_input', `target relative error must be in [1e-5, 0.5], got ${target}`, { key: 'precision' });
}

/**
 * Cross sections of every channel of `model` at sqrt(S) = `energyTeV`, in pb.
 *
 * @example
 * crossSection(loadModel('data-demo/benchmark.model.yaml'), { energyTeV: 13 }).sigmaPb // 0.1287 (pb; MC error 1.9e-4)
 */
export function crossSection(model: Model, options: CrossSectionOptions): CrossSectionResult {
  const settings = crossSectionSettings(options);
  const base: ChannelIntegrationOptions = { sqrtS: 1000 * options.energyTeV, ...settings };
  return crossSectionOf(model, options.energyTeV, model.channels.map((channel) => integrateChannel(channel, base)), settings);
}

/** The checked settings of a cross section, defaults filled in. */
export interface CrossSectionSettings {
  pdf: PartonDensity;
  scaleFactor: number;
  seed: number;
  targetRelativeError: number;
}

export function crossSectionSettings(options: CrossSectionOptions): CrossSectionSettings {
  const scaleFactor = options.scaleFactor ?? 1;
  const seed = options.seed ?? DEFAULT_SEED;
  const targetRelativeError = options.targetRelativeError ?? DEFAULT_TARGET_RELATIVE_ERROR;
  checkGeneratorOptions(options.energyTeV, seed, scaleFactor, targetRelativeError);
  return { pdf: options.pdf ?? lesHouchesToyDensities(), scaleFactor, seed, targetRelativeError };
}

/**
 * The cross-section summary (channels, K-factors, scale band) from the central
 * integrations of every channel of `model` (one per channel, in order): the
 * band re-integrates each channel on its adapted grid at half and twice the
 * scale. Shared by `crossSection` and the event generator's sampler, so a
 * sample's weight and its reported cross section are one number.
 */
export function crossSectionOf(model: Model, energyTeV: number, integrations: readonly ChannelIntegration[], settings: CrossSectionSettings): CrossSectionResult {
  const { pdf, scaleFactor, seed, targetRelativeError } = settings;
  const base: ChannelIntegrationOptions = { sqrtS: 1000 * energyTeV, pdf, scaleFactor, seed, targetRelativeError };
  let reachedTarget = true;
  const channels = model.channels.map((channel, i): ChannelCrossSection => {
    const central = integrations[i]!;
    const lo = central.result.integral;
    const k = channel.kFactor;
    const scale = describeScale(channel, scaleFactor);
    if (central.grid === null) {
      return { name: channel.name, index: channel.index, kFactor: k, sigmaPb: 0, errorPb: 0, sigmaLoPb: 0, scaleBandPb: [0, 0], sigmaHalfScalePb: 0, sigmaDoubleScalePb: 0, scale, calls: 0, chi2PerDof: 0, open: false };
    }
    if (central.result.error > targetRelativeError * Math.abs(lo)) reachedTarget = false;
    const half = integrateAtScale(central, { ...base, scaleFactor: 0.5 * scaleFactor }).integral;
    const double = integrateAtScale(central, { ...base, scaleFactor: 2 * scaleFactor }).integral;
    return {
      name: channel.name,
      index: channel.index,
      kFactor: k,
      sigmaPb: k * lo,
      errorPb: k * central.result.error,
      sigmaLoPb: lo,
      scaleBandPb: [k * Math.min(lo, half, double), k * Math.max(lo, half, double)],
      sigmaHalfScalePb: k * half,
      sigmaDoubleScalePb: k * double,
      scale,
      calls: central.result.calls,
      chi2PerDof: central.result.chi2PerDof,
      open: true,
    };
  });
  // The band of the total: the same scale factor in every channel.
  const totalAt = (pick: (c: ChannelCrossSection) => number): number => channels.reduce((s, c) => s + pick(c), 0);
  const sigmaPb = totalAt((c) => c.sigmaPb);
  const errorPb = Math.sqrt(totalAt((c) => c.errorPb * c.errorPb));
  const half = totalAt((c) => c.sigmaHalfScalePb);
  const double = totalAt((c) => c.sigmaDoubleScalePb);
  return {
    model: model.name,
    energyTeV,
    sigmaPb,
    errorPb,
    scaleBandPb: [Math.min(sigmaPb, half, double), Math.max(sigmaPb, half, double)],
    channels,
    kFactors: Object.fromEntries(model.channels.map((c) => [c.name, c.kFactor])),
    pdfName: pdf.name,
    scaleFactor,
    seed,
    targetRelativeError,
    reachedTarget,
  };
}
