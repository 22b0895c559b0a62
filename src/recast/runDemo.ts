/**
 * `tamis demo`: the invented demo scenario of data-demo/ scanned in mass at
 * 8 and 13 TeV through the four invented demo analyses, plus the energy
 * comparison at the benchmark point; everything written to one folder.
 */
import { join } from 'node:path';
import { packageRoot } from '../io/packageRoot.js';
import { runComparison } from './runComparison.js';
import { runScan, type ScanRun } from './scan/runScan.js';
import type { EnergyComparison } from './compareEnergies.js';

export interface DemoOptions {
  outFolder: string;
  workers?: number;
  onProgress?: (stage: string, done: number, total: number) => void;
}

export interface DemoRun {
  scan: ScanRun;
  comparison: EnergyComparison;
  comparisonText: string;
  files: string[];
}

export async function runDemo(options: DemoOptions): Promise<DemoRun> {
  const root = packageRoot();
  const scan = await runScan({
    scanFile: join(root, 'data-demo', 'demo.scan.yaml'),
    outFolder: options.outFolder,
    ...(options.workers ? { workers: options.workers } : {}),
    fresh: true,
    onProgress: (d, t) => options.onProgress?.('scan points', d, t),
  });
  const comparison = await runComparison({
    modelFile: join(root, 'data-demo', 'benchmark.model.yaml'),
    analyses: [join(root, 'analyses')],
    events: 40_000,
    seed: 2026,
    ...(options.workers ? { workers: options.workers } : {}),
    outFolder: options.outFolder,
    command: 'tamis demo',
    onProgress: (d, t) => options.onProgress?.('comparison', d, t),
  });
  return { scan, comparison: comparison.comparison, comparisonText: comparison.text, files: [...scan.files, ...comparison.files] };
}
