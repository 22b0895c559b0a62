import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { EventRecord } from '../../src/generator/eventRecord.js';
import { LheWriter, formatLheEvent, formatLheReal, parseLheText, readLheFile } from '../../src/generator/lhe/index.js';
import { SAMPLE_INIT, sampleEvents } from './lheTestUtils.js';

const dir = mkdtempSync(join(tmpdir(), 'tamis-lhe-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The value a printed real reads back as: the nearest double of the printed decimals. */
const printed = (x: number, digits = 10): number => Number(formatLheReal(x, digits));

function writeSample(file: string, events: EventRecord[]): void {
  const writer = new LheWriter(file, SAMPLE_INIT, { model: 'invented test pair', settings: { energy_tev: 13, events: events.length, seed: 11 } });
  for (const e of events) writer.writeEvent(e);
  writer.close();
}

describe('Les Houches Event files: write and read', () => {
  const events = sampleEvents(300, 801);

  it('round trip: every field reads back exactly as printed, and write -> read -> write is byte-identical', async () => {
    const first = join(dir, 'first.lhe');
    writeSample(first, events);
    const back: EventRecord[] = [];
    const result = await readLheFile(first, (r) => back.push(r.copy()));
    expect(result.events).toBe(events.length);
    expect(result.init).toEqual(SAMPLE_INIT);
    for (let k = 0; k < events.length; k++) {
      const a = events[k]!;
      const b = back[k]!;
      expect(b.size).toBe(a.size);
      expect([b.processId, b.weight, b.scale, b.alphaQed, b.alphaQcd]).toEqual([a.processId, printed(a.weight), printed(a.scale), printed(a.alphaQed), printed(a.alphaQcd)]);
      for (let i = 0; i < a.size; i++) {
        if (
          b.pdgId[i] !== a.pdgId[i] ||
          b.status[i] !== a.status[i] ||
          b.mother1[i] !== a.mother1[i] ||
          b.mother2[i] !== a.mother2[i] ||
          b.colour1[i] !== a.colour1[i] ||
          b.colour2[i] !== a.colour2[i] ||
          b.mass[i] !== printed(a.mass[i]!) ||
          b.spin[i] !== Math.fround(printed(a.spin[i]!, 4))
        ) {
          expect.fail(`event ${k}, particle ${i}: fields differ`);
        }
        for (let c = 0; c < 4; c++) if (b.momentum[4 * i + c] !== printed(a.momentum[4 * i + c]!)) expect.fail(`event ${k}, particle ${i}, component ${c}`);
      }
    }
    const second = join(dir, 'second.lhe');
    writeSample(second, back);
    expect(readFileSync(second, 'utf8')).toBe(readFileSync(first, 'utf8'));
  });

  it('writes the decay chain with 1-based mothers and status 2 intermediates', () => {
    const text = formatLheEvent(events[0]!);
    const lines = text.trim().split('\n');
    expect(lines[0]).toBe('<event>');
    expect(Number(lines[1]!.trim().split(/\s+/)[0])).toBe(events[0]!.size);
    const particles = lines.slice(2, -1).map((l) => l.trim().split(/\s+/));
    expect(particles[0]!.slice(1, 4)).toEqual(['-1', '0', '0']); // incoming, no mothers
    expect(particles[2]!.slice(1, 4)).toEqual(['2', '1', '2']); // the decayed new particle, from the two partons
    expect(particles.every((p) => p.length === 13)).toBe(true);
  });

  it('reads gzip-compressed files', async () => {
    const plain = join(dir, 'zip.lhe');
    writeSample(plain, events.slice(0, 20));
    const zipped = join(dir, 'zip.lhe.gz');
    writeFileSync(zipped, gzipSync(readFileSync(plain)));
    let n = 0;
    await readLheFile(zipped, () => n++);
    expect(n).toBe(20);
  });

  it('stops after maxEvents', async () => {
    const file = join(dir, 'max.lhe');
    writeSample(file, events.slice(0, 50));
    const result = await readLheFile(file, () => {}, { maxEvents: 7 });
    expect(result.events).toBe(7);
  });

  it('leaves no file when aborted or never closed', () => {
    const aborted = join(dir, 'aborted.lhe');
    const writer = new LheWriter(aborted, SAMPLE_INIT, { model: 'x' });
    writer.writeEvent(events[0]!);
    writer.abort();
    expect(existsSync(aborted)).toBe(false);
    const open = join(dir, 'open.lhe');
    new LheWriter(open, SAMPLE_INIT, { model: 'x' }).writeEvent(events[0]!);
    expect(existsSync(open)).toBe(false);
    const bad = events[0]!.copy();
    bad.momentum[0] = Number.NaN;
    const failing = new LheWriter(join(dir, 'nan.lhe'), SAMPLE_INIT, { model: 'x' });
    expect(() => failing.writeEvent(bad)).toThrow(/non-finite/);
    expect(readdirSync(dir).some((f) => f.startsWith('.nan.lhe'))).toBe(false);
  });

  it("accepts other generators' habits: XML declaration, rich header, comments, trailing weight blocks, Fortran exponents", () => {
    const text = [
      '<?xml version="1.0" encoding="UTF-8"?>',
      '<!-- produced by some other program -->',
      '<LesHouchesEvents version="1.0">',
      '<header>',
      '<MGVersion> any text <init> inside the header is skipped </MGVersion>',
      '<slha>',
      'BLOCK MASS',
      '   6  1.7257E+02',
      '</slha>',
      '</header>',
      '<init>',
      '  2212  2212  4.0000000000D+03  4.0000000000D+03 0 0 10042 10042 3 1',
      '  1.2345E+00  1.0E-02  1.2345E+00  81',
      '<generator name="other" version="1.0">some program</generator>',
      '# a comment line',
      '</init>',
      '<initrwgt><weightgroup name="scale"></weightgroup></initrwgt>',
      '<event>',
      ' 4  81  1.2345E+00  9.1188E+01  7.546771E-03  1.300E-01',
      '# a comment inside the event',
      '       2 -1    0    0  501    0  0.0E+00  0.0E+00  4.6E+01  4.6E+01  0.0E+00 0. 9.',
      '      -2 -1    0    0    0  501  0.0E+00  0.0E+00 -4.6E+01  4.6E+01  0.0E+00 0. 9.',
      '      11  1    1    2    0    0  1.0E+01  2.0E+01  3.0E+01  3.8E+01  5.11E-04 0. -1.',
      '     -11  1    1    2    0    0 -1.0E+01 -2.0E+01 -3.0E+01  5.4E+01  5.11E-04 0. 1.',
      '<mgrwt>',
      '<rscale>  0 0.9E+02</rscale>',
      ' 1 0.5 0.25',
      '</mgrwt>',
      '<rwgt>',
      "<wgt id='1'> 1.2E+00 </wgt>",
      '</rwgt>',
      '</event>',
      '</LesHouchesEvents>',
      '',
    ].join('\r\n');
    const seen: EventRecord[] = [];
    const result = parseLheText(text, (r) => seen.push(r.copy()));
    expect(result.events).toBe(1);
    expect(result.init.beamEnergies).toEqual([4000, 4000]);
    expect(result.init.pdfSets).toEqual([10042, 10042]);
    expect(result.init.processes).toEqual([{ processId: 81, crossSectionPb: 1.2345, errorPb: 0.01, maxWeight: 1.2345 }]);
    const r = seen[0]!;
    expect(r.size).toBe(4);
    expect(Array.from(r.pdgId.subarray(0, 4))).toEqual([2, -2, 11, -11]);
    expect([r.mother1[2], r.mother2[2], r.mother1[0]]).toEqual([0, 1, -1]);
    expect(r.colour1[0]).toBe(501);
    expect(r.spin[2]).toBe(-1);
    expect(r.scale).toBe(91.188);
  });
});
