/**
 * `tamis generate MODEL --energy 13 --events N --seed S --out FILE.lhe|FILE.csv`:
 * unweighted events of a model with full decay chains, written as Les Houches
 * Events (whole decay chain) or CSV of final-state particles.
 */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';
import { parseNumberOption } from '../options.js';

interface GenerateOptions {
  energy: string;
  events: string;
  seed: string;
  out?: string;
}

export function register(program: Command): void {
  program
    .command('generate')
    .description('generate events of a model (hard process and full decay chains) into an LHE or CSV file')
    .argument('<model>', 'model file (*.model.yaml)')
    .option('--energy <TeV>', 'collider energy sqrt(s) in TeV', '13')
    .option('--events <n>', 'number of unweighted events', '10000')
    .option('--seed <n>', 'random seed (same seed, same file)', '1')
    .option('--out <file>', 'output file: .lhe (Les Houches Events, whole decay chain) or .csv (final-state particles)')
    .action(async (modelFile: string, options: GenerateOptions) => {
      const energyTeV = parseNumberOption('--energy', options.energy, { max: 100 });
      if (!(energyTeV > 0)) throw new TamisError('bad_input', `must be > 0 TeV, got ${energyTeV}`, { key: '--energy' });
      const events = parseNumberOption('--events', options.events, { min: 1, max: 2_147_483_647, integer: true });
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const generator = await import('../../generator/writeEventFile.js');
      if (options.out === undefined) throw new TamisError('bad_input', 'an output file is required, e.g. --out events.lhe', { key: '--out' });
      if (generator.eventFileFormat(options.out) === null) {
        throw new TamisError('bad_input', `the file name must end in .lhe or .csv, got "${options.out}"`, { key: '--out' });
      }
      const { loadModel } = await import('../../generator/model/index.js');
      const model = loadModel(modelFile);
      const controller = new AbortController();
      const stop = (): void => controller.abort();
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
      const showProgress = process.stderr.isTTY === true && events > 10_000;
      try {
        const summary = await generator.writeEventFile(model, { energyTeV, events, seed }, options.out, {
          signal: controller.signal,
          onProgress: showProgress ? (done, total) => process.stderr.write(`\rgenerated ${done} of ${total} events`) : undefined,
        });
        if (showProgress) process.stderr.write('\n');
        process.stdout.write(
          `generated ${summary.events} events of ${summary.model} at ${energyTeV} TeV (seed ${seed}): ` +
            `cross section ${summary.crossSectionPb.toPrecision(4)} +- ${summary.errorPb.toPrecision(2)} pb; wrote ${options.out}\n`,
        );
      } finally {
        process.off('SIGINT', stop);
        process.off('SIGTERM', stop);
      }
    });
}
