/** `tamis compare MODEL --energies 8,13 --analyses PATHS`: efficiencies of one model across collider energies. */
import type { Command } from 'commander';
import { parseListOption, parseNumberListOption, parseNumberOption } from '../options.js';
import { progressBar } from '../progress.js';

export function register(program: Command): void {
  program
    .command('compare')
    .description('compare the efficiencies of one model through the analyses of several collider energies, with the cuts that cost the signal')
    .argument('<model>', 'model file (*.model.yaml)')
    .requiredOption('--analyses <paths>', 'comma-separated analysis files or folders')
    .option('--energies <list>', 'collider energies in TeV (default: every energy of the analyses)')
    .option('--events <n>', 'generated events per energy', '50000')
    .option('--seed <n>', 'seed of generation and detector', '1')
    .option('--workers <n>', 'worker threads (default: one per core)')
    .option('--out <folder>', 'also write comparison.csv and comparison.html into this folder')
    .action(async (modelFile: string, options: { analyses: string; energies?: string; events: string; seed: string; workers?: string; out?: string }) => {
      const paths = parseListOption('--analyses', options.analyses);
      const energies = options.energies === undefined ? undefined : parseNumberListOption('--energies', options.energies, { min: 0.1, max: 100 });
      const events = parseNumberOption('--events', options.events, { min: 1, max: 1e8, integer: true });
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const workers = options.workers === undefined ? undefined : parseNumberOption('--workers', options.workers, { min: 1, max: 256, integer: true });
      const { runComparison } = await import('../../recast/runComparison.js');
      const progress = progressBar('events');
      const run = await runComparison({
        modelFile,
        analyses: paths,
        ...(energies ? { energies } : {}),
        events,
        seed,
        ...(workers ? { workers } : {}),
        ...(options.out ? { outFolder: options.out } : {}),
        command: `tamis ${process.argv.slice(2).join(' ')}`,
        onProgress: (d, t) => progress.update(d, t),
      }).finally(() => progress.stop());
      process.stdout.write(`${run.text}\n${run.files.length ? `\nwrote ${run.files.join(', ')}\n` : ''}`);
    });
}
