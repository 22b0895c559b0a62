/** `tamis demo` (and `npm run demo`): the invented demo scenario end to end. */
import type { Command } from 'commander';
import { resolve } from 'node:path';
import { parseNumberOption } from '../options.js';
import { progressBar } from '../progress.js';

export function register(program: Command): void {
  program
    .command('demo')
    .description('scan the invented demo scenario at 8 and 13 TeV through the four invented demo analyses and write the report')
    .option('--out <folder>', 'output folder', 'tamis-demo')
    .option('--workers <n>', 'worker threads (default: one per core)')
    .action(async (options: { out: string; workers?: string }) => {
      const workers = options.workers === undefined ? undefined : parseNumberOption('--workers', options.workers, { min: 1, max: 256, integer: true });
      const { runDemo } = await import('../../recast/runDemo.js');
      const { massLimitTable } = await import('../../recast/scan/scanSummaryText.js');
      process.stdout.write('tamis demo: an invented scenario through four invented analyses (illustration only, not real measurements)\n');
      const started = Date.now();
      let bar = progressBar('scan points');
      let stage = 'scan points';
      const run = await runDemo({
        outFolder: options.out,
        ...(workers ? { workers } : {}),
        onProgress: (name, done, total) => {
          if (name !== stage) {
            bar.stop();
            bar = progressBar(name);
            stage = name;
          }
          bar.update(done, total);
        },
      }).finally(() => bar.stop());
      const seconds = ((Date.now() - started) / 1000).toFixed(1);
      process.stdout.write(`\nmass limits of ${run.scan.scan.name} (${run.scan.scan.points.length} points, ${run.scan.scan.events} events per point and energy):\n\n`);
      process.stdout.write(`${massLimitTable(run.scan, options.out)}\n\n`);
      process.stdout.write(`why the searches differ, at the benchmark point:\n\n${run.comparisonText}\n\n`);
      process.stdout.write(`report: ${resolve(options.out, 'report.html')} (and comparison.html, scan.csv, mass_limits.csv, plots) in ${seconds} s\n`);
      process.stdout.write('approximate reinterpretation: confirm exclusions with the experiments\u2019 own tools before publishing\n');
    });
}
