import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CSV_COLUMNS, CsvEventWriter, formatCsvReal } from '../../src/generator/csvWriter.js';
import { STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { eta, phi, pt } from '../../src/physics/fourVector.js';
import { sampleEvents } from './lheTestUtils.js';

const dir = mkdtempSync(join(tmpdir(), 'tamis-csv-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('CSV of final-state particles', () => {
  it('formats reals with ten significant digits', () => {
    expect(formatCsvReal(1 / 3)).toBe('0.3333333333');
    expect(formatCsvReal(-1234.56789012345)).toBe('-1234.56789');
    expect(formatCsvReal(Infinity)).toBe('inf');
  });

  it('writes one row per status-1 particle with its mother and kinematics', async () => {
    const events = sampleEvents(40, 1101);
    const file = join(dir, 'events.csv');
    const writer = new CsvEventWriter(file);
    events.forEach((e, k) => writer.writeEvent(e, k));
    expect(existsSync(file)).toBe(false); // not before close
    await writer.close();
    const lines = readFileSync(file, 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe(CSV_COLUMNS.join(','));
    const finals = events.reduce((n, e) => n + Array.from(e.status.subarray(0, e.size)).filter((s) => s === STATUS_FINAL).length, 0);
    expect(lines.length - 1).toBe(finals);
    expect(writer.rowCount).toBe(finals);
    // The first row: event 0's first final-state particle.
    const e = events[0]!;
    let i = 0;
    while (e.status[i] !== STATUS_FINAL) i++;
    const m = e.mother1[i]!;
    const p = e.momentum;
    const expected = [0, i, e.pdgId[i], m, e.pdgId[m], p[4 * i], p[4 * i + 1], p[4 * i + 2], p[4 * i + 3], e.mass[i], pt(p, i), eta(p, i), phi(p, i)].map((v, k) => (k < 5 ? String(v) : formatCsvReal(v!)));
    expect(lines[1]!.split(',')).toEqual(expected);
  });

  it('writes the header for an empty sample and nothing when aborted', async () => {
    const empty = join(dir, 'empty.csv');
    const writer = new CsvEventWriter(empty);
    await writer.close();
    expect(readFileSync(empty, 'utf8').trimEnd()).toBe(CSV_COLUMNS.join(','));
    const aborted = join(dir, 'aborted.csv');
    const other = new CsvEventWriter(aborted);
    other.writeEvent(sampleEvents(1, 1102)[0]!, 0);
    other.abort();
    expect(existsSync(aborted)).toBe(false);
  });
});
