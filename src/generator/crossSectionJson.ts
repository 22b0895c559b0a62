/**
 * The machine-readable form of a cross-section result, as `tamis xsec --json`
 * prints it: snake_case keys, pb units, one object.
 */
import type { CrossSectionResult } from './crossSection.js';

export interface CrossSectionJson {
  energy_tev: number;
  sigma_pb: number;
  error_pb: number;
  scale_band_pb: [number, number];
  channels: { name: string; sigma_pb: number; error_pb: number; k_factor: number }[];
}

/**
 * The JSON object of a result (K-factors applied, as in `sigmaPb`).
 *
 * @example
 * crossSectionJson(crossSection(loadModel('data-demo/benchmark.model.yaml'), { energyTeV: 13 })).scale_band_pb
 * // [0.1226, 0.1353] (pb, rounded)
 */
export function crossSectionJson(result: CrossSectionResult): CrossSectionJson {
  return {
    energy_tev: result.energyTeV,
    sigma_pb: result.sigmaPb,
    error_pb: result.errorPb,
    scale_band_pb: [result.scaleBandPb[0], result.scaleBandPb[1]],
    channels: result.channels.map((c) => ({ name: c.name, sigma_pb: c.sigmaPb, error_pb: c.errorPb, k_factor: c.kFactor })),
  };
}
