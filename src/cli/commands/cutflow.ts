/**
 * `tamis cutflow --analyses PATHS --events FILE.lhe`: the cut-flow, region
 * efficiencies with Monte Carlo errors, costliest cut per region and region
 * overlaps of an event sample, as text or JSON.
 */
import type { Command } from 'commander';
import { parseListOption, parseNumberOption } from '../options.js';

export function register(program: Command): void {
  program
    .command('cutflow')
    .description('run analyses on a Les Houches event file: cut-flow, region efficiencies, cut blame, overlaps')
    .requiredOption('--analyses <paths>', 'comma-separated analysis files or folders (a folder means its *.yaml files)')
    .requiredOption('--events <file>', 'Les Houches event file (.lhe, or gzip-compressed)')
    .option('--seed <n>', 'seed of the detector simulation', '1')
    .option('--max-events <n>', 'read at most this many events')
    .option('--json', 'print the full results (every blame entry and overlap) as JSON')
    .action(async (options: { analyses: string; events: string; seed: string; maxEvents?: string; json?: boolean }) => {
      const paths = parseListOption('--analyses', options.analyses);
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const maxEvents = options.maxEvents === undefined ? undefined : parseNumberOption('--max-events', options.maxEvents, { min: 1, integer: true });
      const { loadAnalyses } = await import('../../selection/loader.js');
      const { selectEventFile } = await import('../../selection/eventFile.js');
      const { formatCutflow } = await import('../../selection/cutflowText.js');
      const run = await selectEventFile(loadAnalyses(paths), options.events, maxEvents === undefined ? { seed } : { seed, maxEvents });
      if (options.json) {
        process.stdout.write(`${JSON.stringify(run, null, 2)}\n`);
        return;
      }
      const head = `${run.file}: ${run.events} events at ${run.energyTev} TeV, detector seed ${run.seed}`;
      const skipped = run.skipped.length > 0 ? `\nskipped (other collider energy): ${run.skipped.join(', ')}` : '';
      process.stdout.write(`${head}${skipped}\n\n${run.analyses.map(formatCutflow).join('\n\n')}\n`);
    });
}
