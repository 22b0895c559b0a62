/**
 * Results of recasting one model point: what `summary.json`, `regions.csv`,
 * `cutflow.csv`, the terminal table and the HTML report are written from.
 * Units: cross sections in pb, luminosity in fb^-1, energies in TeV.
 */
import type { ExpectedLimits, ResolvedLimitMethod } from '../stats/index.js';
import type { RequirementCost } from './requirementCosts.js';

/** The model's cross section at one collider energy. */
export interface EnergyCrossSection {
  energyTeV: number;
  sigmaPb: number;
  errorPb: number;
  /** Factorisation-scale band (scale x0.5 and x2), pb. */
  scaleBandPb: [number, number];
  channels: { name: string; sigmaPb: number; errorPb: number; kFactor: number }[];
  /** Events generated at this energy. */
  events: number;
}

export interface RegionOutcome {
  name: string;
  observed: number;
  background: number;
  backgroundUncertainty: number;
  /** Fraction of the produced signal events selected by the region, and its MC error. */
  efficiency: number;
  efficiencyError: number;
  /** Generated events selected (unweighted count). */
  selectedEvents: number;
  /** Expected signal events: sigma x luminosity x efficiency. */
  signal: number;
  /** 95% CL (or the chosen CL) upper limits on signal events. */
  n95Observed: number;
  n95Expected: ExpectedLimits;
  sigma95ObservedPb: number;
  sigma95ExpectedPb: ExpectedLimits;
  /** sigma_model / sigma95, observed and median expected. */
  rObserved: number;
  rExpected: number;
  method: ResolvedLimitMethod;
  /** Published N95 values when the analysis file gives them, and tamis / published. */
  publishedN95Observed?: number;
  publishedN95Expected?: number;
  ratioToPublishedObserved?: number;
  ratioToPublishedExpected?: number;
}

/** What dropping one cut would give a region. */
export interface CutCost {
  kind: 'step' | 'region';
  /** Step name, or the region cut's text. */
  name: string;
  cut: string;
  /** Efficiency of the region with this cut dropped. */
  efficiencyWithout: number;
  /** efficiencyWithout / efficiency with all cuts (Infinity when the region selects nothing). */
  gainFactor: number;
}

export interface StepOutcome {
  name: string;
  cut: string;
  efficiency: number;
  efficiencyError: number;
  selectedEvents: number;
}

export type Verdict = 'excluded' | 'allowed' | 'no sensitivity';

export interface AnalysisOutcome {
  id: string;
  summary: string;
  file: string;
  invented: boolean;
  energyTeV: number;
  luminosityIfb: number;
  detector: string;
  /** Events generated (the denominator of every efficiency). */
  events: number;
  steps: StepOutcome[];
  /**
   * Signal efficiency of the signal regions as a whole: the union of the regions
   * when they are disjoint, else the most efficient region; with its MC error.
   */
  signalRegionEfficiency: { value: number; error: number };
  regions: RegionOutcome[];
  /** Name of the best-expected region (null when no region selects any signal). */
  bestRegion: string | null;
  /** The combination of the analysis's regions (null when they are not declared disjoint or select nothing). */
  combined: { sigma95ObservedPb: number; sigma95ExpectedPb: ExpectedLimits; rObserved: number; rExpected: number } | null;
  /** From the best-expected region: excluded when its observed r >= 1. */
  verdict: Verdict;
  /** For the best region (or the most efficient one): what each single cut costs, costliest first. */
  cutCosts: CutCost[];
  /** What dropping every condition on one variable would give the signal regions, costliest first (empty when not measured). */
  requirementCosts: RequirementCost[];
  /** Region pairs that shared events although declared disjoint. */
  overlaps: { first: string; second: string; events: number; exampleEvents: number[] }[];
}

export interface PointResult {
  model: {
    name: string;
    file: string;
    /** SHA-256 of the model text used (after scan substitutions). */
    sha256: string;
    /** Scan parameters of this point (empty for a single recast). */
    parameters: Record<string, number>;
  };
  seed: number;
  eventsPerEnergy: number;
  cl: number;
  energies: EnergyCrossSection[];
  analyses: AnalysisOutcome[];
}
