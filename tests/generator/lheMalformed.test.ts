/**
 * Malformed Les Houches Event files: each kind of damage is rejected with a
 * `bad_file` TamisError carrying the file and the line of the problem.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { formatLheEvent, formatLheStart, LHE_END, parseLheText, readLheFile } from '../../src/generator/lhe/index.js';
import { SAMPLE_INIT, sampleEvents } from './lheTestUtils.js';

const dir = mkdtempSync(join(tmpdir(), 'tamis-lhe-bad-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const events = sampleEvents(2, 901);
/** A valid file as lines: 1-based line k is lines[k - 1]. */
const valid = (formatLheStart(SAMPLE_INIT, { model: 'm' }) + formatLheEvent(events[0]!) + formatLheEvent(events[1]!) + LHE_END).split('\n');
const lineOf = (prefix: string, occurrence = 1): number => {
  let seen = 0;
  for (let i = 0; i < valid.length; i++) if (valid[i]!.startsWith(prefix) && ++seen === occurrence) return i + 1;
  throw new Error(`no line starting with ${prefix}`);
};
const firstEvent = lineOf('<event>');
const secondEvent = lineOf('<event>', 2);
const initLine = lineOf('<init>');

function rejects(lines: string[], line: number, pattern: RegExp): void {
  try {
    parseLheText(lines.join('\n'), () => {}, { file: 'bad.lhe' });
  } catch (error) {
    expect(error).toBeInstanceOf(TamisError);
    const e = error as TamisError;
    expect(e.code).toBe('bad_file');
    expect(e.file).toBe('bad.lhe');
    expect(e.message).toMatch(pattern);
    expect(e.line).toBe(line);
    return;
  }
  expect.fail('the file was accepted');
}

/** A copy of the valid file with line `k` (1-based) replaced (or deleted when `text` is null). */
function edit(k: number, text: string | null): string[] {
  const copy = [...valid];
  if (text === null) copy.splice(k - 1, 1);
  else copy[k - 1] = text;
  return copy;
}

/** Replaces column `c` (0-based) of line k. */
function editColumn(k: number, c: number, value: string): string[] {
  const fields = valid[k - 1]!.trim().split(/\s+/);
  fields[c] = value;
  return edit(k, fields.join(' '));
}

describe('malformed LHE files are rejected with their line number', () => {
  it('the valid file passes', () => {
    expect(parseLheText(valid.join('\n'), () => {}).events).toBe(2);
  });

  it('truncated: no closing tag, or cut inside an event', () => {
    rejects(valid.slice(0, -2), valid.length - 2, /without <\/LesHouchesEvents>/);
    rejects(valid.slice(0, firstEvent + 3), firstEvent + 3, new RegExp(`inside the event opened at line ${firstEvent}`));
    rejects(valid.slice(0, initLine + 1), initLine + 1, /inside the <init> block/);
    // A line cut in the middle: too few columns.
    rejects(edit(firstEvent + 3, valid[firstEvent + 2]!.slice(0, 40)), firstEvent + 3, /particle 2: expected 13 columns/);
  });

  it('missing tags: <LesHouchesEvents>, <init>, </init>, </event>', () => {
    rejects(valid.slice(1), 1, /expected the <LesHouchesEvents> tag/);
    rejects(['', '', ''], 2, /no <LesHouchesEvents> tag/); // "\n\n": two lines
    const noInit = valid.filter((_, i) => i + 1 < initLine || i + 1 > lineOf('</init>'));
    rejects(noInit, noInit.indexOf('<event>') + 1, /event before the <init> block/);
    rejects(edit(lineOf('</init>'), null), firstEvent - 1, /<init> block opened at line \d+ is not closed/);
    rejects(edit(secondEvent - 1, null), secondEvent - 1, new RegExp(`event opened at line ${firstEvent} is not closed`));
  });

  it('wrong particle count: NUP too large or too small', () => {
    const nup = events[0]!.size;
    rejects(editColumn(firstEvent + 1, 0, String(nup + 1)), secondEvent - 1, new RegExp(`NUP = ${nup + 1} but the event has ${nup} particle`));
    rejects(editColumn(firstEvent + 1, 0, String(nup - 1)), secondEvent - 2, new RegExp(`NUP = ${nup - 1} but more particle lines follow`));
  });

  it('non-numeric and out-of-range fields', () => {
    rejects(editColumn(firstEvent + 2, 6, 'abc'), firstEvent + 2, /particle 1: PUP1 is not a finite number: "abc"/);
    rejects(editColumn(firstEvent + 2, 0, '2.5'), firstEvent + 2, /particle 1: IDUP is not an integer/);
    rejects(editColumn(firstEvent + 2, 9, '1e400'), firstEvent + 2, /PUP4 is not a finite number/);
    rejects(editColumn(firstEvent + 1, 2, 'NaN'), firstEvent + 1, /event line: XWGTUP is not a finite number/);
    rejects(editColumn(initLine + 1, 2, '6.5e3x'), initLine + 1, /<init> beam line: EBMUP1 is not a finite number/);
    rejects(editColumn(initLine + 2, 3, '0.5'), initLine + 2, /LPRUP is not an integer/);
  });

  it('wrong number of columns', () => {
    rejects(edit(firstEvent + 4, `${valid[firstEvent + 3]} 7`), firstEvent + 4, /particle 3: expected 13 columns .* got more/);
    rejects(edit(firstEvent + 1, valid[firstEvent]!.trim().split(/\s+/).slice(0, 5).join(' ')), firstEvent + 1, /event line: expected 6 columns/);
    rejects(edit(initLine + 1, '2212 2212 6500 6500 -1 -1 -1 -1 3'), initLine + 1, /beam line: expected 10 columns/);
  });

  it('mother pointers out of range, invalid status codes, undeclared processes, inconsistent <init>', () => {
    rejects(editColumn(firstEvent + 5, 2, '99'), firstEvent + 5, /particle 4: MOTHUP1 = 99 points outside the event/);
    rejects(editColumn(firstEvent + 5, 3, '-1'), firstEvent + 5, /MOTHUP2 = -1 points outside/);
    rejects(editColumn(firstEvent + 5, 2, '4'), firstEvent + 5, /MOTHUP1 points to the particle itself/);
    rejects(editColumn(firstEvent + 5, 1, '7'), firstEvent + 5, /ISTUP = 7 is not a status code/);
    rejects(editColumn(firstEvent + 2, 0, '0'), firstEvent + 2, /IDUP must not be 0/);
    rejects(editColumn(firstEvent + 5, 4, '-3'), firstEvent + 5, /colour tags must be >= 0/);
    rejects(editColumn(firstEvent + 1, 1, '5'), firstEvent + 1, /IDPRUP = 5 is not among the <init> processes \(0, 1\)/);
    rejects(editColumn(initLine + 1, 9, '3'), lineOf('</init>'), /ends before 1 more process line/);
    rejects(editColumn(initLine + 1, 9, '1'), initLine + 3, /more process lines than NPRUP = 1/);
    rejects(editColumn(initLine + 1, 9, '0'), initLine + 1, /NPRUP must be between 1 and 10000/);
    const twice = [...valid.slice(0, firstEvent - 1), ...valid.slice(initLine - 1, lineOf('</init>')), ...valid.slice(firstEvent - 1)];
    rejects(twice, firstEvent, /second <init> block/);
  });

  it('structure: text outside blocks, stray closing tags, empty events, content after the end, event groups', () => {
    rejects(edit(firstEvent, 'hello'), firstEvent, /unexpected text outside any block/);
    rejects([...valid.slice(0, firstEvent - 1), '</event>', ...valid.slice(firstEvent - 1)], firstEvent, /closing tag <\/event> without an opening tag/);
    rejects([...valid.slice(0, firstEvent), '</event>', ...valid.slice(firstEvent)], firstEvent + 1, /empty event/);
    rejects([...valid, 'more'], valid.length + 1, /content after <\/LesHouchesEvents>/);
    rejects([...valid.slice(0, firstEvent - 1), '<eventgroup>', ...valid.slice(firstEvent - 1)], firstEvent, /event groups/);
  });

  it('files on disk: missing, binary garbage, corrupt gzip, an over-long line', async () => {
    await expect(readLheFile(join(dir, 'none.lhe'), () => {})).rejects.toThrow(/no such file/);
    const garbage = join(dir, 'garbage.lhe');
    writeFileSync(garbage, Buffer.from([0x00, 0xff, 0x13, 0x0a, 0x41]));
    await expect(readLheFile(garbage, () => {})).rejects.toMatchObject({ code: 'bad_file', line: 1, file: garbage });
    const gz = join(dir, 'bad.lhe.gz');
    writeFileSync(gz, Buffer.from([0x1f, 0x8b, 0x08, 0x00, 0x01, 0x02, 0x03]));
    await expect(readLheFile(gz, () => {})).rejects.toMatchObject({ code: 'bad_file', file: gz });
    const long = join(dir, 'long.lhe');
    writeFileSync(long, 'x'.repeat(3 << 20));
    await expect(readLheFile(long, () => {})).rejects.toThrow(/line longer than/);
  });
});
