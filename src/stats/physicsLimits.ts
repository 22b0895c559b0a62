/**
 * From limits on signal counts to limits on cross sections.
 *
 * Units: integrated luminosity in fb^-1, cross sections in pb, and
 * 1 fb^-1 = 1000 pb^-1, so a cross section sigma [pb] gives
 * N = sigma * 1000 * L[fb^-1] * efficiency events.
 */
import { TamisError } from '../errors.js';

/** pb^-1 in one fb^-1. */
export const INVERSE_PICOBARN_PER_INVERSE_FEMTOBARN = 1000;

function requirePositive(value: number, key: string): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new TamisError('bad_input', `${key} must be a finite number > 0, got ${value}`, { key });
}

function requireEfficiency(efficiency: number, key = 'efficiency'): void {
  if (!(efficiency >= 0 && efficiency <= 1)) throw new TamisError('bad_input', `${key} must be in [0, 1], got ${efficiency}`, { key });
}

/**
 * Expected signal events for a cross section, luminosity and efficiency:
 * N = sigma[pb] * 1000 * L[fb^-1] * efficiency.
 *
 * @example
 * signalEvents(0.01, 20.3, 0.05) // 10.15
 */
export function signalEvents(crossSectionPb: number, luminosityInverseFemtobarn: number, efficiency: number): number {
  return crossSectionPb * INVERSE_PICOBARN_PER_INVERSE_FEMTOBARN * luminosityInverseFemtobarn * efficiency;
}

/**
 * The cross-section upper limit sigma95 = N95 / (L * efficiency) in pb, with
 * L in fb^-1 converted to pb^-1 (x 1000). An efficiency of 0 gives Infinity
 * (the selection cannot see the model).
 *
 * @example
 * crossSectionLimit(3.0, 20.3, 0.05) // 0.0029556650246305416 (pb)
 */
export function crossSectionLimit(signalEventLimit: number, luminosityInverseFemtobarn: number, efficiency: number): number {
  if (!(signalEventLimit >= 0)) throw new TamisError('bad_input', `signal event limit must be >= 0, got ${signalEventLimit}`, { key: 'n95' });
  requirePositive(luminosityInverseFemtobarn, 'luminosity');
  requireEfficiency(efficiency);
  if (efficiency === 0) return Number.POSITIVE_INFINITY;
  return signalEventLimit / (INVERSE_PICOBARN_PER_INVERSE_FEMTOBARN * luminosityInverseFemtobarn * efficiency);
}

/**
 * The relative signal uncertainty with the efficiency's Monte Carlo error
 * folded in: sqrt(r^2 + (delta_eff / eff)^2) (independent errors add in
 * quadrature). A zero efficiency contributes nothing (there is no signal to scale).
 *
 * @example
 * signalUncertaintyWithEfficiency(0.05, 0.004, 0.06) // 0.1 (hypot(0.06, 0.08))
 */
export function signalUncertaintyWithEfficiency(efficiency: number, efficiencyError: number, otherRelative = 0): number {
  requireEfficiency(efficiency);
  if (!(efficiencyError >= 0)) throw new TamisError('bad_input', `efficiency error must be >= 0, got ${efficiencyError}`, { key: 'efficiencyError' });
  if (!(otherRelative >= 0)) throw new TamisError('bad_input', `signal uncertainty must be >= 0, got ${otherRelative}`, { key: 'signalUncertainty' });
  const fromEfficiency = efficiency > 0 ? efficiencyError / efficiency : 0;
  return Math.hypot(otherRelative, fromEfficiency);
}

/**
 * r = sigma_model / sigma95: the model is excluded at the chosen CL when r >= 1.
 * A limit of Infinity (no sensitivity) gives r = 0.
 *
 * @example
 * exclusionRatio(0.006, 0.003) // 2
 */
export function exclusionRatio(modelCrossSectionPb: number, crossSectionLimitPb: number): number {
  if (!(modelCrossSectionPb >= 0)) throw new TamisError('bad_input', `model cross section must be >= 0, got ${modelCrossSectionPb}`, { key: 'crossSection' });
  if (!(crossSectionLimitPb > 0)) throw new TamisError('bad_input', `cross-section limit must be > 0, got ${crossSectionLimitPb}`, { key: 'sigma95' });
  return crossSectionLimitPb === Number.POSITIVE_INFINITY ? 0 : modelCrossSectionPb / crossSectionLimitPb;
}

/**
 * The best-expected-region rule: the index of the region with the smallest
 * expected cross-section limit (ties: the first), or -1 when no region is
 * sensitive (every limit infinite). Its observed limit is the one to quote:
 * choosing by the expected limit keeps the choice blind to the observed counts.
 *
 * @example
 * bestExpectedRegion([0.8, 0.2, Infinity, 0.5]) // 1
 */
export function bestExpectedRegion(expectedLimits: readonly number[]): number {
  let best = -1;
  for (let i = 0; i < expectedLimits.length; i++) {
    const value = expectedLimits[i];
    if (Number.isFinite(value) && (best < 0 || value < expectedLimits[best])) best = i;
  }
  return best;
}

/** tamis's limit beside a published one. */
export interface PublishedComparison {
  tamis: number;
  published: number;
  /** tamis / published. */
  ratio: number;
}

/**
 * tamis's N95 beside a published N95 for the same region, with their ratio.
 *
 * @example
 * comparePublished(4.9, 5.0) // { tamis: 4.9, published: 5, ratio: 0.98 }
 */
export function comparePublished(tamisLimit: number, publishedLimit: number): PublishedComparison {
  requirePositive(publishedLimit, 'publishedN95');
  return { tamis: tamisLimit, published: publishedLimit, ratio: tamisLimit / publishedLimit };
}
