/**
 * A detector profile resolved into lookup tables: what the object builder
 * uses. The file format is in ./schema.ts; this is "resolved with defaults",
 * kept apart from "what the user wrote".
 */
import { EfficiencyTable } from '../efficiencyTable.js';
import { EtaBinnedValues } from '../etaBinnedValues.js';
import { ResolutionTable } from '../resolutionTable.js';
import type { DetectorProfileFile, EfficiencyTableFile, EtaValuesFile, ResolutionFile } from './schema.js';

/** A smearing rule: which quantity is measured and its relative resolution. */
export interface MeasuredResolution {
  /** `energy` (calorimeter objects) or `pt` (tracker objects). */
  measured: 'energy' | 'pt';
  table: ResolutionTable;
}

/** Response to electrons, muons or the visible part of hadronic taus. */
export interface LeptonResponse {
  efficiency: EfficiencyTable;
  resolution: MeasuredResolution;
  chargeFlip: EtaBinnedValues;
}

export interface DetectorProfile {
  name: string;
  summary: string;
  colliderEnergyTev: number;
  /** File the profile was read from, if any. */
  file: string | undefined;
  trackerAbsEta: number;
  calorimeterAbsEta: number;
  electrons: LeptonResponse;
  muons: LeptonResponse;
  taus: LeptonResponse & { jetFakeRate: EfficiencyTable };
  jets: {
    /** GeV. */
    minPt: number;
    absEtaMax: number;
    radius: number;
    resolution: MeasuredResolution;
    /** Fraction of jets smeared with the tail Gaussian (0: none). */
    tailFraction: number;
    /** Tail width relative to the core resolution. */
    tailWidthFactor: number;
  };
  bTagging: { b: EfficiencyTable; c: EfficiencyTable; light: EfficiencyTable; tau: EfficiencyTable };
  softTerm: {
    /** GeV per transverse component. */
    constant: number;
    /** GeV^(1/2). */
    stochastic: number;
  };
}

function efficiency(t: EfficiencyTableFile): EfficiencyTable {
  return new EfficiencyTable(t.pt_edges, t.abs_eta_edges, t.values);
}

function etaValues(t: EtaValuesFile): EtaBinnedValues {
  return new EtaBinnedValues(t.abs_eta_edges, t.values);
}

function resolution(r: ResolutionFile): MeasuredResolution {
  const zeros = new Array<number>(r.abs_eta_edges.length - 1).fill(0);
  return {
    measured: r.measured,
    table: new ResolutionTable(r.abs_eta_edges, {
      noise: r.noise ?? zeros,
      stochastic: r.stochastic ?? zeros,
      constant: r.constant ?? zeros,
      linear: r.linear ?? zeros,
    }),
  };
}

/**
 * Builds the lookup tables of a validated profile file (see `parseDetectorProfile`,
 * which validates first and reports problems with file and line).
 */
export function resolveDetectorProfile(data: DetectorProfileFile, file?: string): DetectorProfile {
  const lepton = (l: DetectorProfileFile['electrons']): LeptonResponse => ({
    efficiency: efficiency(l.efficiency),
    resolution: resolution(l.resolution),
    chargeFlip: etaValues(l.charge_flip),
  });
  return {
    name: data.name,
    summary: data.summary,
    colliderEnergyTev: data.collider_energy_tev,
    file,
    trackerAbsEta: data.acceptance.tracker_abs_eta,
    calorimeterAbsEta: data.acceptance.calorimeter_abs_eta,
    electrons: lepton(data.electrons),
    muons: lepton(data.muons),
    taus: { ...lepton(data.taus), jetFakeRate: efficiency(data.taus.jet_fake_rate) },
    jets: {
      minPt: data.jets.min_pt,
      absEtaMax: data.jets.abs_eta_max,
      radius: data.jets.radius,
      resolution: resolution(data.jets.resolution),
      tailFraction: data.jets.response_tail?.fraction ?? 0,
      tailWidthFactor: data.jets.response_tail?.width_factor ?? 1,
    },
    bTagging: {
      b: efficiency(data.b_tagging.b_efficiency),
      c: efficiency(data.b_tagging.c_mistag),
      light: efficiency(data.b_tagging.light_mistag),
      tau: efficiency(data.b_tagging.tau_mistag),
    },
    softTerm: { constant: data.missing_momentum.soft_term_constant, stochastic: data.missing_momentum.soft_term_stochastic },
  };
}
