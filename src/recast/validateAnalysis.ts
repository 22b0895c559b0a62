/**
 * `tamis validate`: when an analysis file carries a reference cut-flow for a
 * named benchmark model, generate that model at the analysis's energy, run the
 * cut-flow and set tamis's expected events beside the reference per step and
 * region. A line is flagged when tamis / reference differs from 1 by more than
 * the tolerance.
 */
import { readTextFile } from '../io/yamlFile.js';
import { TamisError } from '../errors.js';
import { loadAnalysis } from '../selection/loader.js';
import { selectPoint } from './recastPoint.js';

export interface ValidationLine {
  kind: 'step' | 'region';
  name: string;
  reference: number;
  /** tamis's expected events: events before cuts (the reference's) x efficiency. */
  tamis: number;
  /** MC error of `tamis`. */
  tamisError: number;
  ratio: number;
  flagged: boolean;
}

export interface Validation {
  analysis: string;
  modelFile: string;
  source: string;
  energyTeV: number;
  events: number;
  seed: number;
  tolerance: number;
  eventsBeforeCuts: number;
  lines: ValidationLine[];
  /** True when no line is flagged. */
  agrees: boolean;
}

export interface ValidateOptions {
  analysisFile: string;
  events: number;
  seed: number;
  tolerance: number;
  workers?: number;
  onProgress?: (done: number, total: number) => void;
}

export async function validateAnalysis(options: ValidateOptions): Promise<Validation> {
  if (!(options.tolerance > 0 && options.tolerance < 10)) throw new TamisError('bad_input', `tolerance must be in (0, 10), got ${options.tolerance}`, { key: '--tolerance' });
  const analysis = loadAnalysis(options.analysisFile);
  const reference = analysis.referenceCutflow;
  if (reference === undefined) {
    throw new TamisError('bad_input', `analysis ${analysis.id} has no reference cut-flow to validate against`, { file: options.analysisFile, suggestion: 'add a reference_cutflow block (see analyses/README.md)' });
  }
  const point = await selectPoint({
    model: { text: readTextFile(reference.modelFile), file: reference.modelFile },
    analyses: [analysis],
    energies: [analysis.energyTev],
    events: options.events,
    seed: options.seed,
    workers: options.workers ?? 1,
    requirementCosts: false,
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  });
  const selected = point.selections[0]!.selected;
  const n0 = reference.eventsBeforeCuts;
  const line = (kind: 'step' | 'region', name: string, ref: number, efficiency: number, error: number): ValidationLine => {
    const tamis = n0 * efficiency;
    const ratio = ref > 0 ? tamis / ref : tamis > 0 ? Infinity : 1;
    return { kind, name, reference: ref, tamis, tamisError: n0 * error, ratio, flagged: !(Math.abs(ratio - 1) <= options.tolerance) };
  };
  const lines = [
    ...reference.steps.map((s) => {
      const step = selected.steps.find((x) => x.name === s.step)!;
      return line('step', s.step, s.events, step.efficiency, step.efficiencyError);
    }),
    ...reference.regions.map((r) => {
      const region = selected.regions.find((x) => x.name === r.region)!;
      return line('region', r.region, r.events, region.efficiency, region.efficiencyError);
    }),
  ];
  return {
    analysis: analysis.id,
    modelFile: reference.modelFile,
    source: reference.source,
    energyTeV: analysis.energyTev,
    events: options.events,
    seed: options.seed,
    tolerance: options.tolerance,
    eventsBeforeCuts: n0,
    lines,
    agrees: lines.every((l) => !l.flagged),
  };
}
