/**
 * The content lines of a Les Houches Event file (hep-ph/0609017): the init
 * beam line, process lines, the event line and particle lines, each parsed
 * into typed fields with errors that name the file, the line and the column.
 */
import { TamisError } from '../../errors.js';
import type { EventRecord } from '../eventRecord.js';
import { LHE_MAX_PARTICLES, LHE_STATUS_CODES, parseLheInteger, parseLheReal, splitFields, type LheInit, type LheProcess } from './lheFormat.js';

export const PARTICLE_COLUMNS = 'IDUP ISTUP MOTHUP1 MOTHUP2 ICOLUP1 ICOLUP2 PUP1 PUP2 PUP3 PUP4 PUP5 VTIMUP SPINUP';
export const INIT_COLUMNS = 'IDBMUP1 IDBMUP2 EBMUP1 EBMUP2 PDFGUP1 PDFGUP2 PDFSUP1 PDFSUP2 IDWTUP NPRUP';
export const PROCESS_COLUMNS = 'XSECUP XERRUP XMAXUP LPRUP';
export const EVENT_COLUMNS = 'NUP IDPRUP XWGTUP SCALUP AQEDUP AQCDUP';

/** Name of the tag a trimmed line starts with ('' if none); closing tags keep their '/'. */
export function tagOf(line: string): string {
  if (line.charCodeAt(0) !== 60) return '';
  let i = 1;
  if (line.charCodeAt(1) === 47) i = 2;
  let j = i;
  while (j < line.length) {
    const c = line.charCodeAt(j);
    if (c === 32 || c === 9 || c === 62 || c === 47) break;
    j++;
  }
  return line.slice(0, j);
}

/** True if the trimmed line starts like a number (digit, sign or point). */
export function looksNumeric(line: string): boolean {
  const c = line.charCodeAt(0);
  return (c >= 48 && c <= 57) || c === 43 || c === 45 || c === 46;
}

/** The fields of the current line, with located errors. */
export class LheFields {
  readonly file: string;
  line = '';
  lineNumber = 0;
  private readonly starts = new Int32Array(16);
  private readonly ends = new Int32Array(16);

  constructor(file: string) {
    this.file = file;
  }

  fail(message: string, line = this.lineNumber): never {
    throw new TamisError('bad_file', message, { file: this.file, line });
  }

  /** Number of blank-separated fields of `line`, counting at most `max + 1`. */
  count(line: string, max: number): number {
    return splitFields(line, this.starts, this.ends, max);
  }

  /** Splits `line` and requires exactly `expected` fields. */
  split(line: string, expected: number, what: string, columns: string): void {
    this.line = line;
    const n = splitFields(line, this.starts, this.ends, expected);
    if (n !== expected) this.fail(`${what}: expected ${expected} columns (${columns}), got ${n > expected ? 'more' : n}`);
  }

  real(k: number, what: string, name: string): number {
    const v = parseLheReal(this.line, this.starts[k]!, this.ends[k]!);
    if (Number.isNaN(v)) this.fail(`${what}: ${name} is not a finite number: "${this.line.slice(this.starts[k]!, this.ends[k]!)}"`);
    return v;
  }

  integer(k: number, what: string, name: string): number {
    const v = parseLheInteger(this.line, this.starts[k]!, this.ends[k]!);
    if (Number.isNaN(v)) this.fail(`${what}: ${name} is not an integer: "${this.line.slice(this.starts[k]!, this.ends[k]!)}"`);
    return v;
  }
}

/** The init beam line; returns the init block without processes and NPRUP. */
export function readBeamLine(f: LheFields, line: string): { init: LheInit; processCount: number } {
  const what = '<init> beam line';
  f.split(line, 10, what, INIT_COLUMNS);
  const nprup = f.integer(9, what, 'NPRUP');
  const init: LheInit = {
    beamIds: [f.integer(0, what, 'IDBMUP1'), f.integer(1, what, 'IDBMUP2')],
    beamEnergies: [f.real(2, what, 'EBMUP1'), f.real(3, what, 'EBMUP2')],
    pdfGroups: [f.integer(4, what, 'PDFGUP1'), f.integer(5, what, 'PDFGUP2')],
    pdfSets: [f.integer(6, what, 'PDFSUP1'), f.integer(7, what, 'PDFSUP2')],
    weighting: f.integer(8, what, 'IDWTUP'),
    processes: [],
  };
  if (nprup < 1 || nprup > 10_000) f.fail(`${what}: NPRUP must be between 1 and 10000, got ${nprup}`);
  return { init, processCount: nprup };
}

/** One process line of the init block. */
export function readProcessLine(f: LheFields, line: string): LheProcess {
  const what = '<init> process line';
  f.split(line, 4, what, PROCESS_COLUMNS);
  return {
    crossSectionPb: f.real(0, what, 'XSECUP'),
    errorPb: f.real(1, what, 'XERRUP'),
    maxWeight: f.real(2, what, 'XMAXUP'),
    processId: f.integer(3, what, 'LPRUP'),
  };
}

/** The event line: clears `record`, fills its event fields and returns NUP. */
export function readEventLine(f: LheFields, line: string, record: EventRecord, processIds: ReadonlySet<number>): number {
  const what = 'event line';
  f.split(line, 6, what, EVENT_COLUMNS);
  const nup = f.integer(0, what, 'NUP');
  if (nup < 1 || nup > LHE_MAX_PARTICLES) f.fail(`${what}: NUP must be between 1 and ${LHE_MAX_PARTICLES}, got ${nup}`);
  const processId = f.integer(1, what, 'IDPRUP');
  if (!processIds.has(processId)) f.fail(`${what}: process id IDPRUP = ${processId} is not among the <init> processes (${[...processIds].join(', ')})`);
  record.clear();
  record.processId = processId;
  record.weight = f.real(2, what, 'XWGTUP');
  record.scale = f.real(3, what, 'SCALUP');
  record.alphaQed = f.real(4, what, 'AQEDUP');
  record.alphaQcd = f.real(5, what, 'AQCDUP');
  return nup;
}

function checkMother(f: LheFields, what: string, name: string, mother: number, self: number, count: number): void {
  if (mother < 0 || mother > count) f.fail(`${what}: ${name} = ${mother} points outside the event (0 to ${count})`);
  if (mother === self) f.fail(`${what}: ${name} points to the particle itself`);
}

/**
 * Particle line number `self` (from 1) of an event of `count` particles:
 * checks it and appends it to `record` (mothers converted to 0-based, -1 for none).
 */
export function readParticleLine(f: LheFields, line: string, record: EventRecord, self: number, count: number): void {
  const what = `particle ${self}`;
  f.split(line, 13, what, PARTICLE_COLUMNS);
  const id = f.integer(0, what, 'IDUP');
  const status = f.integer(1, what, 'ISTUP');
  const m1 = f.integer(2, what, 'MOTHUP1');
  const m2 = f.integer(3, what, 'MOTHUP2');
  const c1 = f.integer(4, what, 'ICOLUP1');
  const c2 = f.integer(5, what, 'ICOLUP2');
  const px = f.real(6, what, 'PUP1');
  const py = f.real(7, what, 'PUP2');
  const pz = f.real(8, what, 'PUP3');
  const e = f.real(9, what, 'PUP4');
  const m = f.real(10, what, 'PUP5');
  f.real(11, what, 'VTIMUP');
  const spin = f.real(12, what, 'SPINUP');
  if (id === 0) f.fail(`${what}: IDUP must not be 0`);
  if (!LHE_STATUS_CODES.includes(status)) f.fail(`${what}: ISTUP = ${status} is not a status code of the standard (${LHE_STATUS_CODES.join(', ')})`);
  checkMother(f, what, 'MOTHUP1', m1, self, count);
  checkMother(f, what, 'MOTHUP2', m2, self, count);
  if (c1 < 0 || c2 < 0) f.fail(`${what}: colour tags must be >= 0, got ${c1} ${c2}`);
  const i = record.add(id, status, m1 - 1, m2 - 1, px, py, pz, e, m);
  record.colour1[i] = c1;
  record.colour2[i] = c2;
  record.spin[i] = spin;
}
