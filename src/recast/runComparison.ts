/** `tamis compare` as a library call: read inputs, compare energies, optionally write the files. */
import { join } from 'node:path';
import { writeFileAtomic } from '../io/atomicWrite.js';
import { readTextFile } from '../io/yamlFile.js';
import { comparisonCsv, comparisonHtml, comparisonText } from '../report/comparisonReport.js';
import { loadAnalyses } from '../selection/loader.js';
import { compareEnergies, type EnergyComparison } from './compareEnergies.js';
import { defaultWorkers } from './runRecast.js';

export interface RunComparisonOptions {
  modelFile: string;
  analyses: readonly string[];
  energies?: readonly number[];
  events: number;
  seed: number;
  workers?: number;
  outFolder?: string;
  command?: string;
  onProgress?: (done: number, total: number) => void;
}

export async function runComparison(options: RunComparisonOptions): Promise<{ comparison: EnergyComparison; text: string; files: string[] }> {
  const comparison = await compareEnergies({
    model: { text: readTextFile(options.modelFile), file: options.modelFile },
    analyses: loadAnalyses(options.analyses),
    ...(options.energies ? { energies: options.energies } : {}),
    events: options.events,
    seed: options.seed,
    workers: options.workers ?? defaultWorkers(),
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  });
  const files: string[] = [];
  if (options.outFolder !== undefined) {
    const csv = await comparisonCsv(comparison);
    const html = await comparisonHtml(comparison, options.command ?? 'tamis compare');
    writeFileAtomic(join(options.outFolder, 'comparison.csv'), csv);
    writeFileAtomic(join(options.outFolder, 'comparison.html'), html);
    files.push(join(options.outFolder, 'comparison.csv'), join(options.outFolder, 'comparison.html'));
  }
  return { comparison, text: comparisonText(comparison), files };
}
