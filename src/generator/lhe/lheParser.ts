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
import { EventRecord } from '../eventRecord.js';
import type { LheInit } from './lheFormat.js';
import { INIT_COLUMNS, EVENT_COLUMNS, LheFields, looksNumeric, readBeamLine, readEventLine, readParticleLine, readProcessLine, tagOf } from './lheLines.js';

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

/** Called for every complete event; the record is reused, copy it to keep it. */
export type LheEventHandler = (record: EventRecord, index: number) => void;

export interface LheReadResult {
  init: LheInit;
  /** Events passed to the handler. */
  events: number;
}

export class LheParser {
  readonly file: string;
  private readonly onEvent: LheEventHandler;
  private readonly maxEvents: number;
  private readonly record = new EventRecord(64);
  private readonly fields: LheFields;
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
    this.fields = new LheFields(file);
    this.onEvent = onEvent;
    this.maxEvents = maxEvents;
  }

  /** True once `maxEvents` events were read: the caller may stop feeding lines. */
  get stopped(): boolean {
    return this.state === STOPPED;
  }

  private fail(message: string, line = this.lineNumber): never {
    return this.fields.fail(message, line);
  }

  /** Feeds the next line (without its line break). */
  line(raw: string): void {
    this.lineNumber++;
    this.fields.lineNumber = this.lineNumber;
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
      const { init, processCount } = readBeamLine(this.fields, line);
      this.init = init;
      this.remaining = processCount;
      this.state = INIT_PROCESSES;
      return;
    }
    if (this.state === INIT_PROCESSES) {
      if (tag !== '') this.fail(`<init> block: ${this.remaining} more process line(s) expected (NPRUP), found a tag`);
      const process = readProcessLine(this.fields, line);
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
      const nup = readEventLine(this.fields, line, this.record, this.processIds);
      this.particleCount = nup;
      this.remaining = nup;
      this.trailerTags = false;
      this.state = EVENT_PARTICLES;
      return;
    }
    if (this.state === EVENT_PARTICLES) {
      if (tag !== '') this.fail(`wrong particle count: NUP = ${this.particleCount} but the event has ${this.particleCount - this.remaining} particle line(s)`);
      readParticleLine(this.fields, line, this.record, this.particleCount - this.remaining + 1, this.particleCount);
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
    if (!this.trailerTags && looksNumeric(line) && this.fields.count(line, 13) === 13) {
      this.fail(`wrong particle count: NUP = ${this.particleCount} but more particle lines follow`);
    }
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
