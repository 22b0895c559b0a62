/**
 * Median discovery significance of a counting experiment.
 *
 * Closed form for a known background (Cowan, Cranmer, Gross, Vitells,
 * Eur. Phys. J. C 71 (2011) 1554, eq. (97)):
 *   Z_A = sqrt(2 ((s + b) ln(1 + s/b) - s)).
 * `medianDiscoverySignificance` computes the same quantity from tamis's
 * profile likelihood, sqrt(q0) on the Asimov data set n_i = s_i + b_i, so it
 * also covers background uncertainties and several regions; with no
 * uncertainty it must reproduce eq. (97), which the tests check.
 */
import { TamisError } from '../errors.js';
import { CountingModel } from './countingModel.js';
import { ProfileFit } from './profileFit.js';
import { modelRegions } from './combination.js';
import type { CombinationRegion, UncertaintyModel } from './types.js';

/**
 * Z_A of eq. (97) of Cowan et al. (2011): Infinity for b = 0 < s, 0 for s = 0.
 *
 * @example
 * asimovDiscoverySignificance(5, 10) // 1.4709...
 */
export function asimovDiscoverySignificance(signal: number, background: number): number {
  if (!(signal >= 0) || !(background >= 0)) {
    throw new TamisError('bad_input', `signal and background must be >= 0, got ${signal} and ${background}`, { key: 'signal' });
  }
  if (signal === 0) return 0;
  if (background === 0) return Number.POSITIVE_INFINITY;
  return Math.sqrt(2 * ((signal + background) * Math.log1p(signal / background) - signal));
}

/**
 * sqrt(q0) for the Asimov data set of signal plus background (mu = 1, nominal
 * nuisance parameters), with the background-only fit profiling the nuisance
 * parameters. The regions' `observed` fields are ignored.
 *
 * @example
 * medianDiscoverySignificance([{ observed: 0, background: 10, signal: 5 }]) // 1.4709... (eq. 97)
 */
export function medianDiscoverySignificance(regions: readonly CombinationRegion[], uncertaintyModel: UncertaintyModel = 'lognormal'): number {
  const model = new CountingModel(modelRegions(regions), uncertaintyModel);
  const asimov = new Float64Array(model.regionCount);
  for (let i = 0; i < model.regionCount; i++) asimov[i] = model.signal[i] + model.background[i];
  const fit = new ProfileFit(model, asimov);
  const atSignal = fit.profiledNll(1);
  fit.reset();
  const atZero = fit.profiledNll(0);
  if (atZero === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  return Math.sqrt(Math.max(0, 2 * (atZero - atSignal)));
}
