/**
 * One scan point as a task for a worker thread: the point's model text, the
 * analysis files and the settings; the worker recasts it with every chunk in
 * its own thread (points, not chunks, are spread over workers in a scan).
 */
import type { Analysis } from '../../selection/analysis.js';
import { loadAnalysis } from '../../selection/loader.js';
import type { LimitMethod, UncertaintyModel } from '../../stats/index.js';
import { recastPoint } from '../recastPoint.js';
import type { PointResult } from '../types.js';

export interface ScanPointTask {
  index: number;
  parameters: Record<string, number>;
  modelText: string;
  modelFile: string;
  analysisFiles: string[];
  energies: number[];
  events: number;
  seed: number;
  precision: number;
  cl: number;
  method: LimitMethod;
  combinationMethod?: LimitMethod;
  uncertaintyModel: UncertaintyModel;
}

const analyses = new Map<string, Analysis>();

function analysisFor(file: string): Analysis {
  let a = analyses.get(file);
  if (a === undefined) {
    a = loadAnalysis(file);
    analyses.set(file, a);
  }
  return a;
}

export async function runScanPoint(task: ScanPointTask): Promise<PointResult> {
  return recastPoint({
    model: { text: task.modelText, file: task.modelFile },
    analyses: task.analysisFiles.map(analysisFor),
    energies: task.energies,
    events: task.events,
    seed: task.seed,
    parameters: task.parameters,
    pointId: [task.index],
    workers: 1,
    cl: task.cl,
    method: task.method,
    ...(task.combinationMethod === undefined ? {} : { combinationMethod: task.combinationMethod }),
    uncertaintyModel: task.uncertaintyModel,
    targetRelativeError: task.precision,
    // Requirement variants multiply the selection work; scans report single-cut costs only.
    requirementCosts: false,
  });
}
