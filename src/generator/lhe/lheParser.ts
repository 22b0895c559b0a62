/**
 * A line-by-line parser of Les Houches Event files (hep-ph/0609017) that
 * fills one reused EventRecord per event and rejects malformed input with the
 * file and line number.
 *
 * Accepted besides what tamis writes (files of other generators): an XML
 * declaration and comments; any content inside <header>; unknown blocks
 * between the main blocks; lines starting with '<' or '#' after the process
 * lines of <init>; '#' comment lines inside events; after the NUP particle
 * lines, any trailing lines (tags such as <rwgt>, <weights>, <scales>,
 * comments, lines of numbers) except a line that looks like another particle
 * line (13 numeric columns before any tag), which means NUP is wrong; Fortran
 * 'D' exponents. VTIMUP is read and checked but not stored.
 *
 * Rejected, with the line: no <LesHouchesEvents> tag, missing or repeated
 * <init>, <init> with the wrong number of process lines, an event whose
 * particle count differs from NUP, a wrong number of columns, a field that is
 * not a number (or not an integer where the standard wants one), a status
 * code outside the standard's list, a mother pointer outside 0..NUP or to the
 * particle itself, an event process id not declared in <init>, event groups,
 * and files cut short (an open block or no closing tag).
 */
import { TamisError } from '../../errors.js';
import { EventRecord } from '../eventRecord.js';
import { LHE_MAX_PARTICLES, LHE_STATUS_CODES, parseLheInteger, parseLheReal, splitFields, type LheInit } from './lheFormat.js';

const BEFORE_ROOT = 0;
const TOP = 1;
const SKIP_BLOCK = 2;
const COMMENT = 3;
const INIT_FIRST = 4;
const INIT_PROCESSES = 5;
const INIT_EXTRA = 6;
const EVENT_HEADER = 7;
const EVENT_PARTICLES = 8;
const EVENT_TRAILER = 9;
const AFTER_ROOT = 10;
const STOPPED = 11;

const PARTICLE_COLUMNS = 'IDUP ISTUP MOTHUP1 MOTHUP2 ICOLUP1 ICOLUP2 PUP1 PUP2 PUP3 PUP4 PUP5 VTIMUP SPINUP';
const INIT_COLUMNS = 'IDBMUP1 IDBMUP2 EBMUP1 EBMUP2 PDFGUP1 PDFGUP2 PDFSUP1 PDFSUP2 IDWTUP NPRUP';
const PROCESS_COLUMNS = 'XSECUP XERRUP XMAXUP LPRUP';
const EVENT_COLUMNS = 'NUP IDPRUP XWGTUP SCALUP AQEDUP AQCDUP';

/** Called for every complete event; the record is reused, copy it to keep it. */
export type LheEventHandler = (record: EventRecord, index: number) => void;

export interface LheReadResult {
  init: LheInit;
  /** Events passed to the handler. */
  events: number;
}

/** Name of the tag a trimmed line starts with ('' if none); closing tags keep their '/'. */
function tagOf(line: string): string {
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
function looksNumeric(line: string): boolean {
  const c = line.charCodeAt(0);
  return (c >= 48 && c <= 57) || c === 43 || c === 45 || c === 46;
}

export class LheParser {
  readonly file: string;
  private readonly onEvent: LheEventHandler;
  private readonly maxEvents: number;
  private readonly record = new EventRecord(64);
  private readonly starts = new Int32Array(16);
  private readonly ends = new Int32Array(16);
  private state = BEFORE_ROOT;
  private returnState = BEFORE_ROOT;
  private skipUntil = '';
  private lineNumber = 0;
  private blockLine = 0;
  private init: LheInit | null = null;
  private processIds = new Set<number>();
  private remaining = 0;
  private particleCount = 0;
  private trailerTags = false;
  private count = 0;

  /** `file` names the input in error messages; parsing stops after `maxEvents` events. */
  constructor(file: string, onEvent: LheEventHandler, maxEvents = Infinity) {
    this.file = file;
    this.onEvent = onEvent;
    this.maxEvents = maxEvents;
  }

  /** True once `maxEvents` events were read: the caller may stop feeding lines. */
  get stopped(): boolean {
    return this.state === STOPPED;
  }

  private fail(message: string, line = this.lineNumber): never {
    throw new TamisError('bad_file', message, { file: this.file, line });
  }

  /** Feeds the next line (without its line break). */
  line(raw: string): void {
    this.lineNumber++;
    if (this.state === STOPPED) return;
    const line = raw.trim();
    switch (this.state) {
      case BEFORE_ROOT:
        return this.beforeRoot(line);
      case TOP:
        return this.top(line);
      case SKIP_BLOCK:
        if (line.includes(this.skipUntil)) this.state = this.returnState;
        return;
      case COMMENT:
        if (line.includes('-->')) this.state = this.returnState;
        return;
      case INIT_FIRST:
      case INIT_PROCESSES:
      case INIT_EXTRA:
        return this.initLine(line);
      default:
        return this.eventLine(line);
    }
  }

  private openComment(line: string, back: number): boolean {
    if (!line.startsWith('<!--')) return false;
    if (!line.includes('-->', 4)) {
      this.returnState = back;
      this.state = COMMENT;
    }
    return true;
  }

  private beforeRoot(line: string): void {
    if (line === '' || line.startsWith('<?xml') || this.openComment(line, BEFORE_ROOT)) return;
    if (tagOf(line) === '<LesHouchesEvents') {
      this.state = TOP;
      return;
    }
    this.fail(`not a Les Houches Event file: expected the <LesHouchesEvents> tag, found "${line.slice(0, 40)}"`);
  }

  private top(line: string): void {
    if (line === '' || this.openComment(line, TOP)) return;
    const tag = tagOf(line);
    switch (tag) {
      case '<init':
        if (this.init !== null) this.fail(`second <init> block (the first one is complete)`);
        this.state = INIT_FIRST;
        this.blockLine = this.lineNumber;
        return;
      case '<event':
        if (this.init === null) this.fail('event before the <init> block (missing <init>?)');
        this.state = EVENT_HEADER;
        this.blockLine = this.lineNumber;
        return;
      case '</LesHouchesEvents':
        if (this.init === null) this.fail('missing <init> block');
        this.state = AFTER_ROOT;
        return;
      case '<eventgroup':
        this.fail('event groups (<eventgroup>) are not supported: write one <event> per event');
        return;
      case '':
        this.fail(`unexpected text outside any block: "${line.slice(0, 40)}"`);
        return;
      default: {
        if (tag.startsWith('</')) this.fail(`closing tag ${tag}> without an opening tag`);
        // <header> and unknown blocks: skip to their closing tag unless self-closing or closed on this line.
        const closing = `</${tag.slice(1)}>`;
        if (line.endsWith('/>') || line.includes(closing)) return;
        this.skipUntil = closing;
        this.returnState = TOP;
        this.state = SKIP_BLOCK;
      }
    }
  }

  private fields(line: string, expected: number, what: string, columns: string): void {
    const n = splitFields(line, this.starts, this.ends, expected);
    if (n !== expected) {
      this.fail(`${what}: expected ${expected} columns (${columns}), got ${n > expected ? 'more' : n}`);
    }
  }

  private real(line: string, k: number, what: string, name: string): number {
    const v = parseLheReal(line, this.starts[k]!, this.ends[k]!);
    if (Number.isNaN(v)) this.fail(`${what}: ${name} is not a finite number: "${line.slice(this.starts[k]!, this.ends[k]!)}"`);
    return v;
  }

  private integer(line: string, k: number, what: string, name: string): number {
    const v = parseLheInteger(line, this.starts[k]!, this.ends[k]!);
    if (Number.isNaN(v)) this.fail(`${what}: ${name} is not an integer: "${line.slice(this.starts[k]!, this.ends[k]!)}"`);
    return v;
  }

  private initLine(line: string): void {
    if (line === '' || line.startsWith('#')) return;
    const tag = tagOf(line);
    if (tag === '</init') {
      if (this.state !== INIT_EXTRA) {
        const declared = this.state === INIT_FIRST ? 'the beam line' : `${this.remaining} more process line(s) (NPRUP)`;
        this.fail(`<init> block ends before ${declared}`);
      }
      this.state = TOP;
      return;
    }
    if (tag === '<event' || tag === '</LesHouchesEvents' || tag === '<init') this.fail(`<init> block opened at line ${this.blockLine} is not closed`);
    if (this.state === INIT_FIRST) {
      if (tag !== '') this.fail(`<init> block: expected the beam line (${INIT_COLUMNS}), found a tag`);
      this.fields(line, 10, '<init> beam line', INIT_COLUMNS);
      const what = '<init> beam line';
      const names = INIT_COLUMNS.split(' ');
      const ints = [0, 1, 4, 5, 6, 7, 8, 9].map((k) => this.integer(line, k, what, names[k]!));
      const reals = [2, 3].map((k) => this.real(line, k, what, names[k]!));
      const nprup = ints[7]!;
      if (nprup < 1 || nprup > 10_000) this.fail(`<init> beam line: NPRUP must be between 1 and 10000, got ${nprup}`);
      this.init = {
        beamIds: [ints[0]!, ints[1]!],
        beamEnergies: [reals[0]!, reals[1]!],
        pdfGroups: [ints[2]!, ints[3]!],
        pdfSets: [ints[4]!, ints[5]!],
        weighting: ints[6]!,
        processes: [],
      };
      this.remaining = nprup;
      this.state = INIT_PROCESSES;
      return;
    }
    if (this.state === INIT_PROCESSES) {
      if (tag !== '') this.fail(`<init> block: ${this.remaining} more process line(s) expected (NPRUP), found a tag`);
      const what = '<init> process line';
      this.fields(line, 4, what, PROCESS_COLUMNS);
      const process = {
        crossSectionPb: this.real(line, 0, what, 'XSECUP'),
        errorPb: this.real(line, 1, what, 'XERRUP'),
        maxWeight: this.real(line, 2, what, 'XMAXUP'),
        processId: this.integer(line, 3, what, 'LPRUP'),
      };
      this.init!.processes.push(process);
      this.processIds.add(process.processId);
      if (--this.remaining === 0) this.state = INIT_EXTRA;
      return;
    }
    // After the process lines: generator tags and comments are fine, more numbers are not.
    if (tag === '' && looksNumeric(line)) this.fail(`<init> block has more process lines than NPRUP = ${this.init!.processes.length}`);
  }

  private eventLine(line: string): void {
    if (this.state === AFTER_ROOT) {
      if (line === '' || this.openComment(line, AFTER_ROOT)) return;
      this.fail(`content after </LesHouchesEvents>: "${line.slice(0, 40)}"`);
    }
    if (line === '' || line.startsWith('#')) return;
    const tag = tagOf(line);
    if (tag === '<event' || tag === '</LesHouchesEvents' || tag === '<init') {
      this.fail(`event opened at line ${this.blockLine} is not closed before ${tag}>`);
    }
    if (this.state === EVENT_HEADER) {
      if (tag === '</event') this.fail('empty event: no NUP line');
      if (tag !== '') this.fail(`event: expected the event line (${EVENT_COLUMNS}), found ${tag}>`);
      const what = 'event line';
      this.fields(line, 6, what, EVENT_COLUMNS);
      const nup = this.integer(line, 0, what, 'NUP');
      if (nup < 1 || nup > LHE_MAX_PARTICLES) this.fail(`event line: NUP must be between 1 and ${LHE_MAX_PARTICLES}, got ${nup}`);
      const processId = this.integer(line, 1, what, 'IDPRUP');
      if (!this.processIds.has(processId)) this.fail(`event line: process id IDPRUP = ${processId} is not among the <init> processes (${[...this.processIds].join(', ')})`);
      const r = this.record;
      r.clear();
      r.processId = processId;
      r.weight = this.real(line, 2, what, 'XWGTUP');
      r.scale = this.real(line, 3, what, 'SCALUP');
      r.alphaQed = this.real(line, 4, what, 'AQEDUP');
      r.alphaQcd = this.real(line, 5, what, 'AQCDUP');
      this.particleCount = nup;
      this.remaining = nup;
      this.trailerTags = false;
      this.state = EVENT_PARTICLES;
      return;
    }
    if (this.state === EVENT_PARTICLES) {
      if (tag !== '') this.fail(`wrong particle count: NUP = ${this.particleCount} but the event has ${this.particleCount - this.remaining} particle line(s)`);
      this.particle(line);
      if (--this.remaining === 0) this.state = EVENT_TRAILER;
      return;
    }
    // EVENT_TRAILER
    if (tag === '</event') {
      this.onEvent(this.record, this.count);
      this.count++;
      this.state = this.count >= this.maxEvents ? STOPPED : TOP;
      return;
    }
    if (tag !== '') {
      this.trailerTags = true;
      return;
    }
    if (!this.trailerTags && looksNumeric(line) && splitFields(line, this.starts, this.ends, 13) === 13) {
      this.fail(`wrong particle count: NUP = ${this.particleCount} but more particle lines follow`);
    }
  }

  private particle(line: string): void {
    const what = `particle ${this.particleCount - this.remaining + 1}`;
    this.fields(line, 13, what, PARTICLE_COLUMNS);
    const id = this.integer(line, 0, what, 'IDUP');
    const status = this.integer(line, 1, what, 'ISTUP');
    const m1 = this.integer(line, 2, what, 'MOTHUP1');
    const m2 = this.integer(line, 3, what, 'MOTHUP2');
    const c1 = this.integer(line, 4, what, 'ICOLUP1');
    const c2 = this.integer(line, 5, what, 'ICOLUP2');
    const px = this.real(line, 6, what, 'PUP1');
    const py = this.real(line, 7, what, 'PUP2');
    const pz = this.real(line, 8, what, 'PUP3');
    const e = this.real(line, 9, what, 'PUP4');
    const m = this.real(line, 10, what, 'PUP5');
    this.real(line, 11, what, 'VTIMUP');
    const spin = this.real(line, 12, what, 'SPINUP');
    if (id === 0) this.fail(`${what}: IDUP must not be 0`);
    if (!LHE_STATUS_CODES.includes(status)) this.fail(`${what}: ISTUP = ${status} is not a status code of the standard (${LHE_STATUS_CODES.join(', ')})`);
    const self = this.particleCount - this.remaining + 1;
    this.checkMother(what, 'MOTHUP1', m1, self);
    this.checkMother(what, 'MOTHUP2', m2, self);
    if (c1 < 0 || c2 < 0) this.fail(`${what}: colour tags must be >= 0, got ${c1} ${c2}`);
    const r = this.record;
    const i = r.add(id, status, m1 - 1, m2 - 1, px, py, pz, e, m);
    r.colour1[i] = c1;
    r.colour2[i] = c2;
    r.spin[i] = spin;
  }

  private checkMother(what: string, name: string, mother: number, self: number): void {
    if (mother < 0 || mother > this.particleCount) this.fail(`${what}: ${name} = ${mother} points outside the event (0 to ${this.particleCount})`);
    if (mother === self) this.fail(`${what}: ${name} points to the particle itself`);
  }

  /** Checks the end of the input and returns the result. */
  end(): LheReadResult {
    const last = Math.max(1, this.lineNumber);
    switch (this.state) {
      case AFTER_ROOT:
      case STOPPED:
        break;
      case BEFORE_ROOT:
        this.fail('not a Les Houches Event file: no <LesHouchesEvents> tag', last);
        break;
      case TOP:
        this.fail(this.init === null ? 'missing <init> block' : 'file ends without </LesHouchesEvents> (truncated?)', last);
        break;
      case SKIP_BLOCK:
        this.fail(`file ends before ${this.skipUntil} (truncated?)`, last);
        break;
      case COMMENT:
        this.fail('file ends inside a comment (truncated?)', last);
        break;
      case INIT_FIRST:
      case INIT_PROCESSES:
      case INIT_EXTRA:
        this.fail(`file ends inside the <init> block opened at line ${this.blockLine} (truncated?)`, last);
        break;
      default:
        this.fail(`file ends inside the event opened at line ${this.blockLine} (truncated?)`, last);
    }
    return { init: this.init!, events: this.count };
  }
}
