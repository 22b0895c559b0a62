/**
 * Writes the files of one recast into a folder: summary.json, regions.csv,
 * cutflow.csv and report.html. All four are prepared in memory first and then
 * written atomically, so a failed or killed run leaves either the previous
 * files or the new ones, never a half-written file.
 */
import { join } from 'node:path';
import { writeFileAtomic } from '../io/atomicWrite.js';
import { recastReportHtml } from '../report/recastReport.js';
import { cutflowCsv, regionsCsv } from '../report/recastTables.js';
import { summaryJson, type RunInputs } from '../report/summaryJson.js';
import type { PointResult } from './types.js';
import { VERSION } from '../version.js';

export const RECAST_OUTPUT_FILES = ['summary.json', 'regions.csv', 'cutflow.csv', 'report.html'] as const;

export async function writeRecastOutputs(folder: string, result: PointResult, inputs: RunInputs): Promise<string[]> {
  const provenance: [string, string][] = [
    ['tamis version', VERSION],
    ['command', inputs.command],
    ['model file', `${inputs.modelFile} (sha256 ${result.model.sha256.slice(0, 16)}…)`],
    ['analyses', inputs.analysisFiles.join(', ')],
    ['seed', String(result.seed)],
    ['events per energy', String(result.eventsPerEnergy)],
    ['confidence level', String(result.cl)],
  ];
  const contents: [string, string][] = [
    ['summary.json', summaryJson(result, inputs)],
    ['regions.csv', await regionsCsv(result)],
    ['cutflow.csv', await cutflowCsv(result)],
    ['report.html', await recastReportHtml({ result, provenance })],
  ];
  const written: string[] = [];
  for (const [name, text] of contents) {
    const file = join(folder, name);
    writeFileAtomic(file, text);
    written.push(file);
  }
  return written;
}
