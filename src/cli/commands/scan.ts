/**
 * `tamis scan SCAN.yaml`: a grid of model points on worker threads, with
 * checkpoints (a killed scan resumes), shards for batch clusters, and the
 * tables, plots and report when every point is done.
 */
import type { Command } from 'commander';
import { parseNumberOption } from '../options.js';
import { progressBar } from '../progress.js';

export function register(program: Command): void {
  program
    .command('scan')
    .description('scan model parameters: recast every grid point, interpolate the mass limits, write tables, plots and a report')
    .argument('<scan>', 'scan file (*.scan.yaml)')
    .option('--out <folder>', 'output folder (checkpoints in <folder>/points)', 'tamis-scan')
    .option('--workers <n>', 'worker threads (default: one per core)')
    .option('--shard <k/N>', 'run only shard k of N (points with index mod N = k - 1); combine with tamis merge')
    .option('--fresh', 'discard the checkpoints of an earlier run in the output folder')
    .action(async (scanFile: string, options: { out: string; workers?: string; shard?: string; fresh?: boolean }) => {
      const workers = options.workers === undefined ? undefined : parseNumberOption('--workers', options.workers, { min: 1, max: 256, integer: true });
      const { parseShard } = await import('../../recast/scan/shard.js');
      const shard = options.shard === undefined ? undefined : parseShard(options.shard);
      const { runScan } = await import('../../recast/scan/runScan.js');
      const { scanSummaryText } = await import('../../recast/scan/scanSummaryText.js');
      const progress = progressBar('points');
      const run = await runScan({
        scanFile,
        outFolder: options.out,
        ...(workers ? { workers } : {}),
        ...(shard ? { shard } : {}),
        ...(options.fresh ? { fresh: true } : {}),
        onProgress: (done, total) => progress.update(done, total),
      }).finally(() => progress.stop());
      process.stdout.write(`${scanSummaryText(run, options.out, shard)}\n`);
    });
}
