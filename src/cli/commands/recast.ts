/**
 * `tamis recast MODEL --analyses PATHS`: one model point through every
 * analysis, with limits, a terminal table and the files of the run; or
 * `--events FILE.lhe` to recast existing events instead of generating them.
 */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';
import { looksLikeEventFile, parseListOption, parseNumberListOption, parseNumberOption } from '../options.js';
import { parseLimitChoices } from '../limitChoices.js';
import { progressBar } from '../progress.js';

interface RecastCliOptions {
  analyses: string;
  energy?: string;
  events: string;
  crossSection?: string;
  seed: string;
  workers?: string;
  out: string;
  precision: string;
  cl: string;
  method: string;
  uncertaintyModel: string;
}

export function register(program: Command): void {
  program
    .command('recast')
    .description('recast one model point: generate at each energy (or read an LHE file), run every analysis, compute CLs limits, write the report')
    .argument('[model]', 'model file (*.model.yaml); optional with --events FILE.lhe')
    .requiredOption('--analyses <paths>', 'comma-separated analysis files or folders (a folder means its *.yaml files)')
    .option('--energy <list>', 'collider energies in TeV, e.g. 8,13 (default: every energy of the analyses)')
    .option('--events <n|file>', 'generated events per energy, or a Les Houches file (.lhe, .lhe.gz) to recast instead', '50000')
    .option('--cross-section <pb>', 'with an event file: the sample\u2019s cross section in pb (default: from the file)')
    .option('--seed <n>', 'seed of generation, detector and pseudo-experiments', '1')
    .option('--workers <n>', 'worker threads (default: one per core)')
    .option('--out <folder>', 'folder for summary.json, regions.csv, cutflow.csv and report.html', 'tamis-recast')
    .option('--precision <e>', 'relative Monte Carlo error of each generated cross section', '0.01')
    .option('--cl <level>', 'confidence level of the limits', '0.95')
    .option('--method <name>', 'CLs method: exact, toys, asymptotic or auto', 'auto')
    .option('--uncertainty-model <name>', 'background uncertainty shape: lognormal or gaussian', 'lognormal')
    .action(async (modelFile: string | undefined, options: RecastCliOptions) => {
      const analyses = parseListOption('--analyses', options.analyses);
      const energies = options.energy === undefined ? undefined : parseNumberListOption('--energy', options.energy, { min: 0.1, max: 100 });
      const eventFile = looksLikeEventFile(options.events) ? options.events : undefined;
      const events = eventFile === undefined ? parseNumberOption('--events', options.events, { min: 1, max: 1e8, integer: true }) : 0;
      if (eventFile === undefined && modelFile === undefined) throw new TamisError('bad_input', 'give a model file to generate, or --events FILE.lhe to recast existing events', { key: 'model' });
      if (eventFile === undefined && options.crossSection !== undefined) throw new TamisError('bad_input', 'only with --events FILE.lhe: a generated sample takes its cross section from the model (use k_factor there)', { key: '--cross-section' });
      const crossSectionPb = options.crossSection === undefined ? undefined : parseNumberOption('--cross-section', options.crossSection, { min: 1e-30, max: 1e15 });
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const workers = options.workers === undefined ? undefined : parseNumberOption('--workers', options.workers, { min: 1, max: 256, integer: true });
      const precision = parseNumberOption('--precision', options.precision, { min: 1e-4, max: 0.2 });
      const limits = parseLimitChoices(options);
      const { runRecast } = await import('../../recast/runRecast.js');
      const { recastTerminalTable } = await import('../../report/recastTables.js');
      const progress = progressBar('events');
      const { result, files } = await runRecast({
        ...(modelFile ? { modelFile } : {}),
        ...(eventFile ? { eventFile } : {}),
        ...(crossSectionPb !== undefined ? { crossSectionPb } : {}),
        analyses,
        ...(energies ? { energies } : {}),
        events,
        seed,
        ...(workers ? { workers } : {}),
        outFolder: options.out,
        precision,
        ...limits,
        command: `tamis ${process.argv.slice(2).join(' ')}`,
        onProgress: (done, total) => progress.update(done, total),
      }).finally(() => progress.stop());
      const xs = result.energies.map((e) => `${e.energyTeV} TeV: ${e.sigmaPb.toPrecision(4)} pb`).join(', ');
      const source = eventFile ? `${result.eventsPerEnergy} events from ${eventFile}` : `${events} events per energy`;
      process.stdout.write(`${result.model.name}: ${xs}; ${source}, seed ${seed}\n\n${recastTerminalTable(result)}\n\n`);
      process.stdout.write(`wrote ${files.join(', ')}\n`);
      process.stdout.write('approximate reinterpretation: confirm exclusions with the experiments\u2019 own tools before publishing\n');
    });
}
