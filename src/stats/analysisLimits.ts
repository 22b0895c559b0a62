/**
 * The limits of one analysis for one model point: per signal region N95 and
 * sigma95 (observed and expected) and r; the best-expected region; the
 * combination of the (disjoint) regions; and tamis's N95 beside any
 * published N95.
 *
 * Units: luminosity in fb^-1, cross sections in pb (1 fb^-1 = 1000 pb^-1).
 * Randomness: region i uses stream (seed, i) and the combination
 * (seed, number of regions), so the result does not depend on the order in
 * which anything else runs.
 */
import { TamisError } from '../errors.js';
import { RandomStream } from '../physics/random.js';
import { combinedUpperLimit } from './combination.js';
import {
  bestExpectedRegion, comparePublished, crossSectionLimit, exclusionRatio, signalEvents,
  signalUncertaintyWithEfficiency, type PublishedComparison,
} from './physicsLimits.js';
import { BAND_KEYS, type CountingRegion, type ExpectedLimits, type LimitMethod, type LimitOptions, type UpperLimitResult } from './types.js';
import { upperLimit } from './upperLimit.js';

export interface RecastRegion extends CountingRegion {
  name: string;
  /** Fraction of the model's produced events that land in this region, in [0, 1]. */
  efficiency: number;
  /** Absolute Monte Carlo error of `efficiency`. @default 0 */
  efficiencyError?: number;
  /** Regions sharing a group name have fully correlated background uncertainties in the combination. */
  group?: string;
  /** Published observed N95 in events, when the analysis gives one. */
  publishedN95?: number;
  /** Published expected N95 in events, when the analysis gives one. */
  publishedExpectedN95?: number;
}

export interface RecastSettings {
  /** Integrated luminosity in fb^-1. */
  luminosity: number;
  /** The model's production cross section in pb. */
  crossSection: number;
  /** Fold each efficiency's Monte Carlo error into the signal uncertainty. @default true */
  foldEfficiencyError?: boolean;
  /** Combine the regions (they must be disjoint). @default true when there are several */
  combine?: boolean;
  /** Method of the combination (pseudo-experiments over many regions are the slow part of a scan). @default the regions' method */
  combinationMethod?: LimitMethod;
}

/** Observed and expected cross-section limits in pb, and r = sigma_model / sigma95. */
export interface CrossSectionLimits {
  observed: number;
  expected: ExpectedLimits;
  rObserved: number;
  /** r against the median expected limit. */
  rExpected: number;
}

export interface RegionLimits {
  name: string;
  /** Expected signal events of the model in this region. */
  signal: number;
  /** Limits on the signal count (events). */
  n95: UpperLimitResult;
  sigma95: CrossSectionLimits;
  published?: { observed?: PublishedComparison; expected?: PublishedComparison };
}

export interface AnalysisLimits {
  regions: RegionLimits[];
  /** Index into `regions` of the best-expected region, -1 when no region sees the model. */
  bestRegion: number;
  /** The combination of all regions (absent for one region or with `combine: false`). */
  combined?: { limit: UpperLimitResult; sigma95: CrossSectionLimits };
}

function crossSectionLimits(observed: number, expected: ExpectedLimits, toPicobarn: (n: number) => number, model: number): CrossSectionLimits {
  const sigmaExpected = { ...expected };
  for (const key of BAND_KEYS) sigmaExpected[key] = toPicobarn(expected[key]);
  const sigmaObserved = toPicobarn(observed);
  return {
    observed: sigmaObserved,
    expected: sigmaExpected,
    rObserved: exclusionRatio(model, sigmaObserved),
    rExpected: exclusionRatio(model, sigmaExpected.median),
  };
}

/** A random stream for one part of the analysis, from the options' seed or rng. */
function streamFor(options: LimitOptions, index: number): RandomStream {
  return options.rng !== undefined ? options.rng.split() : RandomStream.forStream(options.seed ?? 1, index);
}

/**
 * Limits of one analysis for one model point (see the module comment).
 * Throws `bad_input` for out-of-range efficiencies, luminosity or counts.
 *
 * @example
 * const result = analysisLimits(
 *   [{ name: 'SR1', observed: 3, background: 2.1, backgroundUncertainty: 0.6, efficiency: 0.012 }],
 *   { luminosity: 20.3, crossSection: 0.05 },
 * );
 * result.regions[0].sigma95.rObserved // the model's r in SR1
 */
export function analysisLimits(regions: readonly RecastRegion[], settings: RecastSettings, options: LimitOptions = {}): AnalysisLimits {
  if (regions.length === 0) throw new TamisError('bad_input', 'an analysis needs at least one region', { key: 'regions' });
  const { luminosity, crossSection } = settings;
  if (!(luminosity > 0) || !Number.isFinite(luminosity)) throw new TamisError('bad_input', `luminosity must be > 0 (fb^-1), got ${luminosity}`, { key: 'luminosity' });
  if (!(crossSection >= 0) || !Number.isFinite(crossSection)) throw new TamisError('bad_input', `cross section must be >= 0 (pb), got ${crossSection}`, { key: 'crossSection' });
  regions.forEach((region, i) => {
    if (!(region.efficiency >= 0 && region.efficiency <= 1)) {
      throw new TamisError('bad_input', `efficiency must be in [0, 1], got ${region.efficiency} (region "${region.name}")`, { key: `regions[${i}].efficiency` });
    }
  });
  const fold = settings.foldEfficiencyError ?? true;
  const perRegion = regions.map((region, i): RegionLimits => {
    const signalUncertainty = fold
      ? signalUncertaintyWithEfficiency(region.efficiency, region.efficiencyError ?? 0, region.signalUncertainty ?? 0)
      : region.signalUncertainty ?? 0;
    const n95 = upperLimit({ ...region, signalUncertainty }, { ...options, rng: streamFor(options, i) });
    const toPicobarn = (n: number): number => crossSectionLimit(n, luminosity, region.efficiency);
    const result: RegionLimits = {
      name: region.name,
      signal: signalEvents(crossSection, luminosity, region.efficiency),
      n95,
      sigma95: crossSectionLimits(n95.observed, n95.expected, toPicobarn, crossSection),
    };
    if (region.publishedN95 !== undefined || region.publishedExpectedN95 !== undefined) {
      result.published = {};
      if (region.publishedN95 !== undefined) result.published.observed = comparePublished(n95.observed, region.publishedN95);
      if (region.publishedExpectedN95 !== undefined) result.published.expected = comparePublished(n95.expected.median, region.publishedExpectedN95);
    }
    return result;
  });
  const bestRegion = bestExpectedRegion(perRegion.map((r) => r.sigma95.expected.median));
  const analysis: AnalysisLimits = { regions: perRegion, bestRegion };
  const sensitive = regions.some((r) => r.efficiency > 0);
  if ((settings.combine ?? true) && regions.length > 1 && sensitive) {
    // Signal in events per pb: the limit on mu is then the cross-section limit in pb.
    const perPicobarn = regions.map((region) => ({
      ...region,
      signal: signalEvents(1, luminosity, region.efficiency),
      signalUncertainty: fold
        ? signalUncertaintyWithEfficiency(region.efficiency, region.efficiencyError ?? 0, region.signalUncertainty ?? 0)
        : region.signalUncertainty ?? 0,
    }));
    const limit = combinedUpperLimit(perPicobarn, {
      ...options,
      ...(settings.combinationMethod === undefined ? {} : { method: settings.combinationMethod }),
      rng: streamFor(options, regions.length),
    });
    analysis.combined = { limit, sigma95: crossSectionLimits(limit.observed, limit.expected, (mu) => mu, crossSection) };
  }
  return analysis;
}
