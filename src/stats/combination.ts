/**
 * Upper limits for several disjoint counting regions combined, on the signal
 * strength mu: the factor that multiplies every region's expected signal.
 * Background uncertainties of regions sharing a `group` name are fully
 * correlated (one nuisance parameter moves them all); all others are
 * independent, as are the signal uncertainties (disjoint regions are filled by
 * independent Monte Carlo events).
 */
import { TamisError } from '../errors.js';
import { chooseMethod, equivalentSingleRegion } from './autoMethod.js';
import { asymptoticLimits } from './clsAsymptotic.js';
import { toyLimitsCombined } from './clsToysCombined.js';
import { CountingModel, type ModelRegion } from './countingModel.js';
import type { CombinationRegion, ExpectedLimits, LimitOptions, ResolvedLimitMethod, UpperLimitResult } from './types.js';
import { checkLimits, upperLimitResolved } from './upperLimit.js';
import { requireCount, resolveOptions, resolveRegion } from './validate.js';

function scaleExpected(expected: ExpectedLimits, factor: number): ExpectedLimits {
  return {
    minus2: expected.minus2 * factor,
    minus1: expected.minus1 * factor,
    median: expected.median * factor,
    plus1: expected.plus1 * factor,
    plus2: expected.plus2 * factor,
  };
}

/** Checked model regions with group names turned into indices (ungrouped regions get their own). */
export function modelRegions(regions: readonly CombinationRegion[]): ModelRegion[] {
  if (!Array.isArray(regions) || regions.length === 0) throw new TamisError('bad_input', 'a combination needs at least one region', { key: 'regions' });
  const groups = new Map<string, number>();
  let groupCount = 0;
  const result = regions.map((region, i) => {
    const where = region?.name !== undefined ? ` (region "${region.name}")` : '';
    const checked = resolveRegion(region, `regions[${i}].`, where);
    const signal = requireCount(region.signal, `regions[${i}].signal`, where);
    let group: number;
    if (region.group === undefined || region.group === '') {
      group = groupCount++;
    } else {
      if (typeof region.group !== 'string') {
        throw new TamisError('bad_input', `group must be a name, got ${String(region.group)}${where}`, { key: `regions[${i}].group` });
      }
      const known = groups.get(region.group);
      group = known ?? groupCount++;
      if (known === undefined) groups.set(region.group, group);
    }
    return { ...checked, signal, group };
  });
  if (!result.some((r) => r.signal > 0)) {
    throw new TamisError('bad_input', 'at least one region needs a signal > 0', { key: 'regions[].signal' });
  }
  return result;
}

/**
 * CLs upper limits on the signal strength mu of a combination of disjoint
 * regions (observed, and expected with ±1σ, ±2σ bands). Multiply by the
 * regions' signal to get events, or by the model cross section to get a
 * cross-section limit. `exact` exists for one region only.
 *
 * @example
 * // two identical regions with n = 0: CLs = e^-2mu, so mu = 1.498 (3.00 events in total,
 * // 1.50 per region, against 3.00 for either region alone)
 * combinedUpperLimit([{ observed: 0, background: 1, signal: 1 }, { observed: 0, background: 1, signal: 1 }], { method: 'toys' }).observed // ~1.50
 */
export function combinedUpperLimit(regions: readonly CombinationRegion[], options: LimitOptions = {}): UpperLimitResult {
  const model = modelRegions(regions);
  const resolved = resolveOptions(options, model.length > 1);
  if (model.length === 1) {
    const only = model[0];
    const single = upperLimitResolved(only, resolved);
    return { ...single, observed: single.observed / only.signal, expected: scaleExpected(single.expected, 1 / only.signal) };
  }
  if (resolved.method === 'exact') {
    throw new TamisError('bad_input', 'the exact method handles one region; a combination needs "toys" or "asymptotic"', {
      key: 'method',
      suggestion: 'use method "auto"',
    });
  }
  const counting = new CountingModel(model, resolved.uncertaintyModel);
  let method: ResolvedLimitMethod = resolved.method === 'auto'
    ? chooseMethod(equivalentSingleRegion(model).observed, equivalentSingleRegion(model).background, true, false)
    : resolved.method;
  const asymptotic = asymptoticLimits(counting, resolved.cl);
  let result: { observed: number; expected: ExpectedLimits; clsAtLimitError: number; toys: number } = {
    ...asymptotic,
    clsAtLimitError: 0,
    toys: 0,
  };
  if (method === 'toys') {
    // The asymptotic limit is a cheap, close starting point for the pseudo-experiment search.
    result = toyLimitsCombined(counting, {
      cl: resolved.cl,
      uncertaintyModel: resolved.uncertaintyModel,
      rng: resolved.rng,
      tolerance: resolved.toyTolerance,
      minToys: resolved.minToys,
      maxToys: resolved.maxToys,
    }, asymptotic.observed);
  } else {
    method = 'asymptotic';
  }
  checkLimits(result.observed, result.expected, method);
  return { ...result, method, cl: resolved.cl };
}
