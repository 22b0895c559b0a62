/**
 * The limits of one analysis as a task for a worker thread: the analysis file,
 * its merged selection results (plain data) and the model's cross section.
 * Each analysis draws its pseudo-experiments from its own stream, so running
 * them on any thread gives the same numbers.
 */
import type { Analysis } from '../selection/analysis.js';
import { loadAnalysis } from '../selection/loader.js';
import type { AnalysisResult } from '../selection/results.js';
import { analysisOutcome, type LimitSettings } from './analysisOutcome.js';
import type { AnalysisOutcome } from './types.js';

export interface LimitTask {
  kind: 'limits';
  analysisFile: string;
  selected: AnalysisResult;
  crossSectionPb: number;
  settings: LimitSettings;
}

const analyses = new Map<string, Analysis>();

export function runLimitTask(task: LimitTask): AnalysisOutcome {
  let analysis = analyses.get(task.analysisFile);
  if (analysis === undefined) {
    analysis = loadAnalysis(task.analysisFile);
    analyses.set(task.analysisFile, analysis);
  }
  return analysisOutcome(analysis, task.selected, task.crossSectionPb, task.settings);
}
