/**
 * The resolved analysis: what the selection engine and the statistics use,
 * with defaults filled in, cut expressions parsed and paths resolved.
 */
import type { SourceLocation } from '../errors.js';
import type { CutExpression } from './expression/ast.js';
import type { ObjectDefinitions } from './objects.js';

/** One cut expression as written and as parsed, with where it was written. */
export interface Cut {
  text: string;
  expression: CutExpression;
  location: SourceLocation;
}

export interface SelectionStep {
  name: string;
  cut: Cut;
}

export interface SignalRegion {
  name: string;
  /** Cut expressions applied (all of them) after the selection steps. */
  cuts: Cut[];
  observed: number;
  /** Expected background, events. */
  background: number;
  /** Total background uncertainty, events. */
  backgroundUncertainty: number;
  /** Published 95% CL upper limits on signal events, when given. */
  n95Observed?: number;
  n95Expected?: number;
  location: SourceLocation;
}

export interface CorrelationGroup {
  name: string;
  regions: string[];
}

export interface ReferenceCutflow {
  /** Benchmark model file, resolved against the analysis file's folder. */
  modelFile: string;
  source: string;
  eventsBeforeCuts: number;
  steps: { step: string; events: number }[];
  regions: { region: string; events: number }[];
}

export interface Analysis {
  id: string;
  summary: string;
  /** True for demo analyses with invented numbers. */
  invented: boolean;
  reference?: string;
  /** The file it was read from, as given. */
  file: string;
  /** Where the id is written (for errors about the analysis as a whole). */
  location: SourceLocation;
  /** Proton-proton centre-of-mass energy, TeV. */
  energyTev: number;
  /** Integrated luminosity, fb^-1. */
  luminosityIfb: number;
  /**
   * Detector profile: the file, resolved against the analysis file's folder
   * (for a shipped profile named in the file, its path in analyses/detectors/);
   * loaded without file checks, a shipped profile's name as written.
   */
  detectorFile: string;
  objects: ObjectDefinitions;
  steps: SelectionStep[];
  regions: SignalRegion[];
  regionsDisjoint: boolean;
  correlationGroups: CorrelationGroup[];
  referenceCutflow?: ReferenceCutflow;
}
