/**
 * `tamis xsec MODEL --energy 13 [--json] [--seed S] [--precision 0.005]`: the
 * leading-order cross section of every production channel with its Monte
 * Carlo error, K-factor and scale band, and the total.
 */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';
import { parseNumberOption } from '../options.js';

interface XsecOptions {
  energy: string;
  json?: boolean;
  seed: string;
  precision: string;
  scaleFactor: string;
  grid?: string;
}

export function register(program: Command): void {
  program
    .command('xsec')
    .description('cross section of each production channel of a model: MC error, K-factor, scale band (x0.5, x2)')
    .argument('<model>', 'model file (*.model.yaml)')
    .option('--energy <TeV>', 'collider energy sqrt(s) in TeV (7, 8, 13, 13.6, 14 or any value up to 100)', '13')
    .option('--json', 'print one JSON object: {energy_tev, sigma_pb, error_pb, scale_band_pb, channels}')
    .option('--seed <n>', 'random seed of the integration (same seed, same numbers)', '1')
    .option('--precision <relative>', 'target relative Monte Carlo error of each channel', '0.005')
    .option('--scale-factor <f>', 'multiplies each channel\'s scale mu_F = mu_R (default choice: the pair\'s average mass)', '1')
    .option('--grid <file.csv>', 'parton densities from a tabulated grid (layout of `tamis pdf --write-grid`) instead of the built-in ones')
    .action(async (modelFile: string, options: XsecOptions) => {
      const energyTeV = parseNumberOption('--energy', options.energy, { max: 100 });
      if (!(energyTeV > 0)) throw new TamisError('bad_input', `must be > 0 TeV, got ${energyTeV}`, { key: '--energy' });
      const seed = parseNumberOption('--seed', options.seed, { min: 0, max: Number.MAX_SAFE_INTEGER, integer: true });
      const precision = parseNumberOption('--precision', options.precision, { min: 1e-5, max: 0.5 });
      const scaleFactor = parseNumberOption('--scale-factor', options.scaleFactor, { min: 0.1, max: 10 });
      const { loadModel } = await import('../../generator/model/index.js');
      const { crossSection } = await import('../../generator/crossSection.js');
      const model = loadModel(modelFile);
      const pdf = options.grid === undefined ? undefined : (await import('../../physics/pdf/index.js')).readDensityGridCsv(options.grid);
      const result = crossSection(model, { energyTeV, seed, targetRelativeError: precision, scaleFactor, pdf });
      if (options.json) {
        const { crossSectionJson } = await import('../../generator/crossSectionJson.js');
        process.stdout.write(`${JSON.stringify(crossSectionJson(result), null, 2)}\n`);
        return;
      }
      const { formatTable, formatNumber } = await import('../../report/terminalTable.js');
      const columns = [{ header: 'channel' }, { header: 'sigma [pb]', alignRight: true }, { header: 'MC error [pb]', alignRight: true }, { header: 'K-factor', alignRight: true }, { header: 'scale band [pb]', alignRight: true }, { header: 'mu_F = mu_R', alignRight: true }];
      const band = (b: readonly [number, number]): string => `${formatNumber(b[0])} - ${formatNumber(b[1])}`;
      const rows = result.channels.map((c) => [c.name, c.open ? formatNumber(c.sigmaPb) : 'closed', formatNumber(c.errorPb, 2), c.kFactor.toFixed(2), band(c.scaleBandPb), c.scale]);
      rows.push(['total', formatNumber(result.sigmaPb), formatNumber(result.errorPb, 2), '', band(result.scaleBandPb)]);
      process.stdout.write(
        `${result.model} at sqrt(s) = ${energyTeV} TeV, leading order (approximate; K-factors applied as shown)\n` +
          `densities: ${result.pdfName}; scale band: mu_F = mu_R x0.5 and x2; seed ${seed}\n\n` +
          `${formatTable(columns, rows)}\n` +
          (result.reachedTarget ? '' : `\nwarning: some channels did not reach the ${precision} relative error within the call limit\n`),
      );
    });
}
