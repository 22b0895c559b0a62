import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { mzNormalisedAlphaS } from '../../src/physics/alphaS.js';
import { parseDensityGridCsv, readDensityGridCsv, writeDensityGridCsv } from '../../src/physics/pdf/csvGrid.js';
import { lesHouchesToyDensities } from '../../src/physics/pdf/lesHouchesGrid.js';
import { expectClose } from '../helpers.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-pdf-csv-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const HEADER = 'x,q,g,d,u,s,c,b,dbar,ubar,sbar,cbar,bbar';
/** A small valid grid: 4 x values at 2 q values, x f = simple smooth shapes. */
function smallGrid(): string[] {
  const lines = ['# an invented test grid', HEADER];
  for (const q of [10, 100]) {
    for (const x of [0.001, 0.01, 0.1, 0.5]) {
      const sea = 0.2 * x ** -0.2 * (1 - x) ** 7 * (q / 10) ** 0.1;
      const values = [3 * sea, sea + x ** 0.5 * (1 - x) ** 3, sea + 2 * x ** 0.5 * (1 - x) ** 3, sea / 2, sea / 4, sea / 8, sea, sea, sea / 2, sea / 4, sea / 8];
      lines.push([x, q, ...values].join(','));
    }
  }
  return lines;
}

/** Parses `lines` and returns the TamisError it throws. */
function errorOf(lines: string[]): TamisError {
  try {
    parseDensityGridCsv(lines.join('\n'), 'grid.csv');
  } catch (error) {
    expect(error).toBeInstanceOf(TamisError);
    return error as TamisError;
  }
  throw new Error('expected the grid to be rejected');
}

describe('CSV density grids', () => {
  it('round trip: the built-in grid written to CSV and read back agrees at nodes and between them', () => {
    const builtIn = lesHouchesToyDensities();
    const file = join(folder, 'nested', 'toy.csv');
    writeDensityGridCsv(file, builtIn);
    expect(readdirSync(join(folder, 'nested'))).toEqual(['toy.csv']); // no temporary file left behind
    expect(readFileSync(file, 'utf8').split('\n')[2]).toBe(HEADER);
    const loaded = readDensityGridCsv(file, { alphaS: (q) => builtIn.alphaS(q) });
    expect(loaded.name).toBe('CSV grid toy.csv');
    expect(Array.from(loaded.data.x)).toEqual(Array.from(builtIn.data.x));
    expect(Array.from(loaded.data.q)).toEqual(Array.from(builtIn.data.q));
    const a = new Float64Array(11);
    const b = new Float64Array(11);
    // Values are written with 10 significant digits.
    for (let iq = 0; iq < builtIn.data.q.length; iq += 3) {
      for (let ix = 0; ix < builtIn.data.x.length; ix += 7) {
        loaded.xfxColumns(builtIn.data.x[ix]!, builtIn.data.q[iq]!, a);
        builtIn.xfxColumns(builtIn.data.x[ix]!, builtIn.data.q[iq]!, b);
        for (let c = 0; c < 11; c++) expectClose(a[c]!, b[c]!, { rel: 1e-9, abs: 1e-300 });
      }
    }
    // Between nodes the same interpolation applies; only the heavy-quark limit at a threshold
    // row is extrapolated instead of computed, which matters just above m_c and m_b.
    for (const [x, q, rel] of [[3e-5, 50, 1e-8], [0.23, 700, 1e-8], [0.05, 1.5, 1e-3], [0.05, 4.8, 1e-3]] as const) {
      loaded.xfxColumns(x, q, a);
      builtIn.xfxColumns(x, q, b);
      for (let c = 0; c < 11; c++) expectClose(a[c]!, b[c]!, { rel }, `column ${c} at x = ${x}, Q = ${q}`);
    }
    // Thresholds are recognised from the zero rows of c and b.
    expect(loaded.xfx(5, 0.01, 4.4)).toBe(0);
    expect(loaded.xfx(5, 0.01, 4.6)).toBeGreaterThan(0);
  });

  it('accepts comments, blank lines, columns and rows in any order, CRLF line ends', () => {
    const lines = smallGrid();
    const header = lines[1]!.split(',');
    const order = [12, 0, 5, 1, 2, 3, 4, 6, 7, 8, 9, 10, 11];
    const shuffled = ['', '# comment', order.map((k) => header[k]).join(', ')];
    for (const line of lines.slice(2).reverse()) {
      const cells = line.split(',');
      shuffled.push(order.map((k) => cells[k]).join(','), '');
    }
    const file = join(folder, 'shuffled.csv');
    writeFileSync(file, shuffled.join('\r\n'));
    const grid = readDensityGridCsv(file);
    expect(Array.from(grid.data.x)).toEqual([0.001, 0.01, 0.1, 0.5]);
    expect(Array.from(grid.data.q)).toEqual([10, 100]);
    const x = 0.1;
    const sea = 0.2 * x ** -0.2 * (1 - x) ** 7 * 10 ** 0.1;
    expectClose(grid.xfx(21, x, 100), 3 * sea, { rel: 1e-12 });
    expectClose(grid.xfx(-5, x, 100), sea / 8, { rel: 1e-12 });
    expect(grid.alphaS(91.188)).toBe(mzNormalisedAlphaS.alphaS(91.188));
  });

  it('names file, line, column and key for a value that is not a number', () => {
    const lines = smallGrid();
    lines[4] = lines[4]!.replace(/^([^,]*,[^,]*,)[^,]*/, '$1abc');
    const error = errorOf(lines);
    expect(error.message).toMatch(/not a number: "abc"/);
    expect([error.file, error.line, error.key]).toEqual(['grid.csv', 5, 'g']);
    expect(error.column).toBe(lines[4]!.indexOf('abc') + 1);
    expect(error.code).toBe('schema');
  });

  it('rejects a missing column, an unknown column and a repeated column', () => {
    const missing = smallGrid().map((line, k) => (k === 0 ? line : line.split(',').slice(0, 12).join(',')));
    expect(errorOf(missing)).toMatchObject({ line: 2, key: 'bbar', message: 'missing column "bbar"' });
    const unknown = smallGrid();
    unknown[1] = unknown[1]!.replace('bbar', 'bottom');
    expect(errorOf(unknown)).toMatchObject({ line: 2, key: 'bottom', column: unknown[1]!.indexOf('bottom') + 1 });
    expect(errorOf(unknown).suggestion).toMatch(/x, q, g, d, u/);
    const repeated = smallGrid();
    repeated[1] = repeated[1]!.replace('bbar', 'g');
    expect(errorOf(repeated).message).toMatch(/appears twice/);
  });

  it('rejects a line with the wrong number of values', () => {
    const lines = smallGrid();
    lines[6] = `${lines[6]},1`;
    expect(errorOf(lines)).toMatchObject({ line: 7, message: 'expected 13 values, found 14' });
  });

  it('rejects negative and non-finite values, x outside (0, 1) and q <= 0', () => {
    const edit = (row: number, column: number, value: string): string[] => {
      const lines = smallGrid();
      const cells = lines[row]!.split(',');
      cells[column] = value;
      lines[row] = cells.join(',');
      return lines;
    };
    expect(errorOf(edit(3, 4, '-0.5'))).toMatchObject({ line: 4, key: 'u', message: 'x f must be >= 0, got -0.5' });
    expect(errorOf(edit(3, 5, 'Infinity'))).toMatchObject({ line: 4, key: 's' });
    expect(errorOf(edit(3, 5, '1e999')).message).toMatch(/finite/);
    expect(errorOf(edit(3, 6, 'NaN')).message).toMatch(/not a number/);
    expect(errorOf(edit(3, 7, '')).message).toMatch(/not a number/);
    expect(errorOf(edit(3, 0, '1'))).toMatchObject({ line: 4, key: 'x', message: 'x must be in (0, 1), got 1' });
    expect(errorOf(edit(3, 0, '0'))).toMatchObject({ key: 'x' });
    expect(errorOf(edit(3, 1, '0'))).toMatchObject({ line: 4, key: 'q', message: 'q must be > 0 GeV, got 0' });
  });

  it('rejects a grid that is not rectangular, a repeated point, too few points and an empty file', () => {
    const missingPoint = smallGrid();
    missingPoint.splice(5, 1);
    expect(errorOf(missingPoint).message).toMatch(/not rectangular: 1 \(x, q\) point\(s\) missing, the first x = 0.5, q = 10/);
    const repeated = smallGrid();
    repeated.push(repeated[3]!);
    expect(errorOf(repeated)).toMatchObject({ line: 11, message: expect.stringMatching(/already given on line 4/) });
    const tooFew = [HEADER, '0.1,10,1,1,1,1,1,1,1,1,1,1,1', '0.2,10,1,1,1,1,1,1,1,1,1,1,1'];
    expect(errorOf(tooFew).message).toMatch(/too few points: 2 distinct x value/);
    expect(errorOf(['# only a comment', '']).message).toMatch(/no header line/);
    expect(errorOf([HEADER]).message).toMatch(/too few points: 0/);
  });

  it('reports a file that cannot be read', () => {
    expect(() => readDensityGridCsv(join(folder, 'absent.csv'))).toThrow(/cannot read file: ENOENT/);
  });
});
