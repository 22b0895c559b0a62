/**
 * Variants of the shipped profiles for tests that isolate one effect: a
 * constant efficiency, a perfect resolution, no jet tail, a chosen soft term.
 */
import { EfficiencyTable } from '../../src/detector/efficiencyTable.js';
import type { DetectorProfile, MeasuredResolution } from '../../src/detector/profile/detectorProfile.js';
import { findDetectorProfile } from '../../src/detector/profile/builtInProfiles.js';
import { ResolutionTable } from '../../src/detector/resolutionTable.js';

export const PROFILE_8TEV = findDetectorProfile('generic-8tev');
export const PROFILE_13TEV = findDetectorProfile('generic-13tev');

/** The same probability everywhere inside the tracker (|eta| < 2.5) above 0 GeV. */
export function constantTable(probability: number): EfficiencyTable {
  return new EfficiencyTable([0, 100_000], [0, 2.5], [[probability]]);
}

/** A measurement with no smearing at all. */
export function perfectResolution(measured: 'energy' | 'pt' = 'energy'): MeasuredResolution {
  return { measured, table: new ResolutionTable([0, 10], { noise: [0], stochastic: [0], constant: [0], linear: [0] }) };
}

/** `base` with perfect resolutions for every object, no jet tail and no soft-term smearing. */
export function perfectProfile(base: DetectorProfile = PROFILE_8TEV): DetectorProfile {
  return {
    ...base,
    electrons: { ...base.electrons, resolution: perfectResolution() },
    muons: { ...base.muons, resolution: perfectResolution('pt') },
    taus: { ...base.taus, resolution: perfectResolution() },
    jets: { ...base.jets, resolution: perfectResolution(), tailFraction: 0 },
    softTerm: { constant: 0, stochastic: 0 },
  };
}
