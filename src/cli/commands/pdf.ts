/**
 * `tamis pdf --x 1e-4,0.01 --q 100 [--json]`: x f(x, Q) of every parton, from the
 * built-in LO toy densities or a CSV grid (`--grid`); `--write-grid` saves the grid as CSV.
 */
import type { Command } from 'commander';
import { TamisError } from '../../errors.js';
import { parseNumberListOption } from '../options.js';

interface PdfOptions {
  x?: string;
  q: string;
  json?: boolean;
  grid?: string;
  writeGrid?: string;
}

/** Comma-separated values strictly inside (lo, hi), for --x and --q. */
function openRangeList(option: string, text: string, lo: number, hi: number, what: string): number[] {
  const values = parseNumberListOption(option, text);
  for (const v of values) {
    if (!(v > lo && v < hi)) throw new TamisError('bad_input', `must be ${what}, got ${v}`, { key: option });
  }
  return values;
}

export function register(program: Command): void {
  program
    .command('pdf')
    .description('print x f(x, Q) of every parton (g d u s c b dbar ubar sbar cbar bbar) and alpha_s')
    .option('--x <list>', 'momentum fractions, comma-separated, each in (0, 1)')
    .option('--q <list>', 'factorisation scales in GeV, comma-separated', '100')
    .option('--json', 'print a JSON array, one object per (x, q): {x, q, alpha_s, xf: {g, d, ...}}')
    .option('--grid <file.csv>', 'use a tabulated grid (CSV layout: header x,q,g,d,u,s,c,b,dbar,ubar,sbar,cbar,bbar) instead of the built-in densities')
    .option('--write-grid <file.csv>', 'write the densities\' grid in that CSV layout')
    .action(async (options: PdfOptions) => {
      if (options.x === undefined && options.writeGrid === undefined) {
        throw new TamisError('bad_input', 'a list of momentum fractions is required, e.g. --x 1e-4,0.01,0.1', { key: '--x' });
      }
      const xs = options.x === undefined ? [] : openRangeList('--x', options.x, 0, 1, 'in (0, 1)');
      const qs = openRangeList('--q', options.q, 0, Infinity, '> 0 GeV');
      const pdf = await import('../../physics/pdf/index.js');
      const density = options.grid !== undefined ? pdf.readDensityGridCsv(options.grid) : pdf.lesHouchesToyDensities();
      for (const q of qs) {
        if (q < density.qMin || q > density.qMax) {
          throw new TamisError('bad_input', `must be within the densities' range ${density.qMin} to ${density.qMax} GeV, got ${q}`, { key: '--q' });
        }
      }
      if (options.writeGrid !== undefined) {
        pdf.writeDensityGridCsv(options.writeGrid, density);
        process.stderr.write(`wrote ${options.writeGrid}: ${density.data.x.length} x values at ${density.data.q.length} q values\n`);
      }
      if (xs.length === 0) return;
      const rows = pdf.densityTable(density, xs, qs);
      process.stdout.write(options.json ? `${JSON.stringify(rows, null, 2)}\n` : pdf.formatDensityTable(rows, density.name));
    });
}
