/** `tamis validate ANALYSIS`: tamis's cut-flow of the analysis's benchmark model beside its reference cut-flow. */
import type { Command } from 'commander';
import { parseNumberOption } from '../options.js';
import { progressBar } from '../progress.js';

export function register(program: Command): void {
  program
    .command('validate')
    .description('run the benchmark model named in an analysis file and compare the cut-flow with its reference, step by step')
    .argument('<analysis>', 'analysis file with a reference_cutflow block')
    .option('--events <n>', 'generated events', '100000')
    .option('--seed <n>', 'seed of generation and detector', '1')
    .option('--tolerance <t>', 'flag steps where |tamis / reference - 1| exceeds this', '0.2')
    .option('--workers <n>', 'worker threads (default: one per core)')
    .action(async (analysisFile: string, options: { events: string; seed: string; tolerance: string; workers?: string }) => {
      const events = parseNumberOption('--events', options.events, { min: 1, max: 1e8, integer: true });
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const tolerance = parseNumberOption('--tolerance', options.tolerance, { min: 1e-6, max: 9.99 });
      const workers = options.workers === undefined ? undefined : parseNumberOption('--workers', options.workers, { min: 1, max: 256, integer: true });
      const { validateAnalysis } = await import('../../recast/validateAnalysis.js');
      const { validationText } = await import('../../report/validationText.js');
      const { defaultWorkers } = await import('../../recast/runRecast.js');
      const progress = progressBar('events');
      const validation = await validateAnalysis({ analysisFile, events, seed, tolerance, workers: workers ?? defaultWorkers(), onProgress: (d, t) => progress.update(d, t) }).finally(() => progress.stop());
      process.stdout.write(`${validationText(validation)}\n`);
      if (!validation.agrees) process.exitCode = 1;
    });
}
