import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { limitJson, regionTableJson } from '../../src/stats/limitReport.js';
import { fieldColumn, parseRegionsCsv, readRegionsCsv } from '../../src/stats/regionsCsv.js';
import { regionTableLimits } from '../../src/stats/regionTable.js';
import { upperLimit } from '../../src/stats/upperLimit.js';
import { expectClose } from '../helpers.js';

async function errorOf(text: string): Promise<Record<string, unknown>> {
  try {
    await parseRegionsCsv(text, 'regions.csv');
  } catch (error) {
    return error as Record<string, unknown>;
  }
  throw new Error('no error');
}

describe('region tables from CSV', () => {
  it('reads the doc example and optional columns; skips comments and empty lines', async () => {
    expect(await parseRegionsCsv('name,observed,background,uncertainty\nSR1,3,2.1,0.6\n', 'sr.csv')).toEqual([
      { name: 'SR1', observed: 3, background: 2.1, backgroundUncertainty: 0.6, signal: 1, line: 2 },
    ]);
    const text = '# invented demo table\nname,observed,background,uncertainty,group,signal,signal_uncertainty\n\nA,0,0.8,0.3,fakes,2.5,\n"B, high",12,9.5,2.1,fakes,1,0.1\nC,4,3,1,,,\n';
    const rows = await parseRegionsCsv(text, 'sr.csv');
    expect(rows.map((r) => [r.name, r.line, r.group, r.signal, r.signalUncertainty])).toEqual([
      ['A', 4, 'fakes', 2.5, undefined],
      ['B, high', 5, 'fakes', 1, 0.1],
      ['C', 6, undefined, 1, undefined],
    ]);
  });

  it('locates errors by file, line and character column', async () => {
    expect(await errorOf('name,observed,background,uncertainty\nA,1,2,0.5\nB,1.5,2,0.5\n')).toMatchObject({
      file: 'regions.csv', line: 3, column: 3, key: 'observed', message: 'must be a whole number of events, got 1.5',
    });
    expect(await errorOf('name,observed,background,uncertainty\nA,1,-2,0.5\n')).toMatchObject({ line: 2, column: 5, key: 'background', message: 'must be >= 0, got -2' });
    expect(await errorOf('name,observed,background,uncertainty\nA,1,two,0.5\n')).toMatchObject({ line: 2, key: 'background', message: 'expected a number, got "two"' });
    expect(await errorOf('name,observed,backgrund,uncertainty\n')).toMatchObject({ line: 1, column: 15, message: 'unknown column "backgrund"', suggestion: 'did you mean "background"?' });
    expect(await errorOf('name,observed,background\nA,1,2\n')).toMatchObject({ line: 1, message: 'missing column "uncertainty"' });
    expect(await errorOf('name,observed,background,uncertainty\nA,1,2\n')).toMatchObject({ line: 2, message: 'expected 4 fields, found 3' });
    expect(await errorOf('name,observed,background,uncertainty\nA,1,2,0\nA,2,2,0\n')).toMatchObject({ line: 3, message: 'region "A" appears twice' });
    expect(await errorOf('name,observed,background,uncertainty\n')).toMatchObject({ message: 'no regions after the header line' });
    expect(await errorOf('')).toMatchObject({ message: 'no header line' });
    expect(await errorOf('name,observed,background,uncertainty\n"A,1,2,0\n')).toMatchObject({ code: 'bad_file' });
    expect(fieldColumn('"a,b",c,d', 2)).toBe(9);
  });

  it('reads a file and reports a missing one', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'tamis-csv-'));
    const file = join(folder, 'sr.csv');
    writeFileSync(file, 'name,observed,background,uncertainty\nSR1,3,2.1,0.6\n');
    expect((await readRegionsCsv(file))[0].name).toBe('SR1');
    await expect(readRegionsCsv(join(folder, 'missing.csv'))).rejects.toMatchObject({ message: 'file not found' });
  });

  it('limits per region, the best-expected region and the combination; JSON keys for scripts', async () => {
    const rows = await parseRegionsCsv('name,observed,background,uncertainty\nA,0,0.8,0\nB,9,7.5,0\n', 'sr.csv');
    const table = regionTableLimits(rows, { method: 'auto' });
    expectClose(table.regions[0].limit.observed, 2.995732273553991, { rel: 1e-9 });
    expectClose(table.regions[1].limit.observed, upperLimit(rows[1]).observed, { rel: 1e-12 });
    expect(table.bestExpected).toBe(0);
    expect(table.combined?.method).toBe('toys');
    const json = regionTableJson(table, 0.95, 'auto') as Record<string, unknown>;
    expect(Object.keys(json)).toEqual(['cl', 'method', 'regions', 'combined', 'best_expected_region']);
    const first = (json.regions as Record<string, unknown>[])[0];
    expect(Object.keys(first)).toEqual(['name', 'method', 'observed_limit', 'expected_limit', 'cls_at_limit_error', 'toys']);
    expect(Object.keys(first.expected_limit as object)).toEqual(['minus2', 'minus1', 'median', 'plus1', 'plus2']);
    expect(json.best_expected_region).toBe('A');
    expect(Object.keys(limitJson(table.regions[0].limit))).toEqual(['cl', 'method', 'observed_limit', 'expected_limit', 'cls_at_limit_error', 'toys']);
  });

  it('the exact method runs the regions exactly and the combination with pseudo-experiments', async () => {
    const rows = await parseRegionsCsv('name,observed,background,uncertainty\nA,2,1.5,0\nB,3,2.5,0\n', 'sr.csv');
    const table = regionTableLimits(rows, { method: 'exact' });
    expect(table.regions.map((r) => r.limit.method)).toEqual(['exact', 'exact']);
    expect(table.combined?.method).toBe('toys');
  });
});
