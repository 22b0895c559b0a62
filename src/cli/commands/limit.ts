/**
 * `tamis limit --observed N --background B --uncertainty DB [...]`: CLs upper
 * limits on the signal count of one counting region, or with `--regions
 * FILE.csv` of every region of a table and of their combination.
 */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';
import { formatNumber, formatTable } from '../../report/terminalTable.js';
import { parseNumberOption } from '../options.js';

interface LimitCliOptions {
  observed?: string; background?: string; uncertainty?: string; signalUncertainty: string; method: string; cl: string;
  uncertaintyModel: string; seed: string; regions?: string; json?: boolean;
}

function choice<T extends string>(option: string, value: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(value)) throw new TamisError('bad_input', `expected one of ${allowed.join(', ')}, got "${value}"`, { key: option });
  return value as T;
}

export function register(program: Command): void {
  program
    .command('limit')
    .description('CLs upper limits on signal events from observed counts and background estimates')
    .option('--observed <n>', 'observed events (whole number)')
    .option('--background <b>', 'expected background events')
    .option('--uncertainty <db>', 'absolute uncertainty on the background, in events', '0')
    .option('--signal-uncertainty <r>', 'relative uncertainty on the signal (0.1 = 10%)', '0')
    .option('--method <name>', 'exact | toys | asymptotic | auto', 'auto')
    .option('--cl <level>', 'confidence level', '0.95')
    .option('--uncertainty-model <name>', 'background constraint: lognormal | gaussian (truncated at zero)', 'lognormal')
    .option('--seed <n>', 'seed of the pseudo-experiments', '1')
    .option('--regions <file>', 'CSV of regions (name,observed,background,uncertainty[,group,signal,signal_uncertainty]); prints each region and the combination')
    .option('--json', 'print one JSON object')
    .action(async (o: LimitCliOptions) => {
      const stats = await import('../../stats/index.js');
      const { limitJson, limitRow, LIMIT_COLUMNS, regionTableJson } = await import('../../stats/limitReport.js');
      const options = {
        cl: parseNumberOption('--cl', o.cl, { min: 0, max: 1 }),
        method: choice('--method', o.method, stats.LIMIT_METHODS),
        uncertaintyModel: choice('--uncertainty-model', o.uncertaintyModel, stats.UNCERTAINTY_MODELS),
        seed: parseNumberOption('--seed', o.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true }),
      };
      if (!(options.cl > 0 && options.cl < 1)) throw new TamisError('bad_input', `must be strictly between 0 and 1, got ${options.cl}`, { key: '--cl' });
      const signalUncertainty = parseNumberOption('--signal-uncertainty', o.signalUncertainty, { min: 0 });
      const cells = (values: number[]): string[] => values.map((v) => formatNumber(v));
      const header = `${options.cl * 100}% CL CLs upper limits`;
      if (o.regions !== undefined) {
        if (o.observed !== undefined || o.background !== undefined) throw new TamisError('bad_input', 'give either --regions or --observed/--background, not both', { key: '--regions' });
        const { readRegionsCsv } = await import('../../stats/regionsCsv.js');
        const { regionTableLimits } = await import('../../stats/regionTable.js');
        const table = regionTableLimits(await readRegionsCsv(o.regions), options, signalUncertainty);
        if (o.json) return void process.stdout.write(`${JSON.stringify(regionTableJson(table, options.cl, options.method), null, 2)}\n`);
        const rows = table.regions.map(({ row, limit }) => [row.name, String(row.observed), ...cells([row.background, row.backgroundUncertainty]), ...cells(limitRow(limit)), limit.method]);
        if (table.combined !== undefined) rows.push(['combined (mu)', '', '', '', ...cells(limitRow(table.combined)), table.combined.method]);
        const columns = ['region', 'n', 'b', 'db', ...LIMIT_COLUMNS, 'method'].map((h, j) => ({ header: h, alignRight: j > 0 && h !== 'method' }));
        const best = table.regions[table.bestExpected]?.row.name ?? 'none';
        process.stdout.write(`${header} on signal events per region; combined row: on the signal strength mu (multiples of the signal column)\n${formatTable(columns, rows)}\nbest expected region: ${best}\n`);
        return;
      }
      if (o.observed === undefined || o.background === undefined) throw new TamisError('bad_input', 'give --observed and --background (or --regions FILE.csv)', { key: '--observed' });
      const region = {
        observed: parseNumberOption('--observed', o.observed, { min: 0, integer: true }),
        background: parseNumberOption('--background', o.background, { min: 0 }),
        backgroundUncertainty: parseNumberOption('--uncertainty', o.uncertainty ?? '0', { min: 0 }),
        signalUncertainty,
      };
      const result = stats.upperLimit(region, options);
      if (o.json) return void process.stdout.write(`${JSON.stringify(limitJson(result))}\n`);
      const columns = ['', ...LIMIT_COLUMNS].map((h, j) => ({ header: h, alignRight: j > 0 }));
      const toys = result.method === 'toys' ? `\n${result.toys} pseudo-experiments (seed ${options.seed}); CLs error at the observed limit ${formatNumber(result.clsAtLimitError)}` : '';
      process.stdout.write(`${header} on signal events (method: ${result.method})\n${formatTable(columns, [['events', ...cells(limitRow(result))]])}${toys}\n`);
    });
}
