/**
 * Writes Les Houches Event files (hep-ph/0609017) with the whole decay chain:
 * incoming partons (status -1), the produced pair and every decayed
 * intermediate t, W, Z, h, tau or new particle (status 2, with its generated
 * mass in PUP5) and the final state (status 1); mother pointers count from 1
 * (0 = none), so anyone can check the kinematics of each decay.
 *
 * The file is streamed through an AtomicFileWriter: it appears under its name
 * only when `close()` succeeds; `abort()` (or a crash) leaves no partial file.
 */
import { TamisError } from '../../errors.js';
import { AtomicFileWriter } from '../../io/atomicWrite.js';
import { VERSION } from '../../version.js';
import type { EventRecord } from '../eventRecord.js';
import { formatLheInteger, formatLheReal, LHE_MAX_PARTICLES, type LheInit } from './lheFormat.js';

/** What the header says about the sample. */
export interface LheHeaderInfo {
  /** Model name (or any label of the sample). */
  model: string;
  /** Generation settings, written as `key = value` lines (energy, events, seed, ...). */
  settings?: Record<string, string | number>;
}

/** Buffered text is handed to the file once it passes this many characters. */
const FLUSH_CHARACTERS = 1 << 20;

/** Text safe inside an XML element: no markup characters, no line breaks. */
function plainText(value: string | number): string {
  return String(value).replace(/[<>&\r\n]/g, ' ');
}

/**
 * The opening of a file: root tag, header with the tamis version, the model
 * and the settings, and the init block.
 */
export function formatLheStart(init: LheInit, header: LheHeaderInfo): string {
  const lines = ['<LesHouchesEvents version="3.0">', '<header>', '<tamis_generation>', `program = tamis ${VERSION}`, `model = ${plainText(header.model)}`];
  for (const [key, value] of Object.entries(header.settings ?? {})) lines.push(`${plainText(key)} = ${plainText(value)}`);
  lines.push('</tamis_generation>', '</header>', '<init>');
  const [b1, b2] = init.beamIds;
  const [e1, e2] = init.beamEnergies;
  lines.push(
    `${formatLheInteger(b1, 7)}${formatLheInteger(b2, 7)} ${formatLheReal(e1)} ${formatLheReal(e2)}${formatLheInteger(init.pdfGroups[0], 4)}${formatLheInteger(init.pdfGroups[1], 4)}${formatLheInteger(init.pdfSets[0], 4)}${formatLheInteger(init.pdfSets[1], 4)}${formatLheInteger(init.weighting, 4)}${formatLheInteger(init.processes.length, 4)}`,
  );
  for (const p of init.processes) {
    lines.push(`${formatLheReal(p.crossSectionPb)} ${formatLheReal(p.errorPb)} ${formatLheReal(p.maxWeight)}${formatLheInteger(p.processId, 6)}`);
  }
  lines.push('</init>', '');
  return lines.join('\n');
}

/** The end of a file. */
export const LHE_END = '</LesHouchesEvents>\n';

/**
 * One `<event>` block for the current content of `record`. Throws a `bad_input`
 * TamisError for a non-finite value or more particles than LHE_MAX_PARTICLES.
 */
export function formatLheEvent(record: EventRecord): string {
  const n = record.size;
  if (n < 1 || n > LHE_MAX_PARTICLES) throw new TamisError('bad_input', `an LHE event holds 1 to ${LHE_MAX_PARTICLES} particles, got ${n}`);
  let text = `<event>\n${formatLheInteger(n, 3)}${formatLheInteger(record.processId, 5)} ${formatLheReal(record.weight)} ${formatLheReal(record.scale)} ${formatLheReal(record.alphaQed)} ${formatLheReal(record.alphaQcd)}\n`;
  const p = record.momentum;
  for (let i = 0; i < n; i++) {
    const o = 4 * i;
    const px = p[o]!;
    const py = p[o + 1]!;
    const pz = p[o + 2]!;
    const e = p[o + 3]!;
    const m = record.mass[i]!;
    if (!Number.isFinite(px + py + pz + e + m)) throw new TamisError('bad_input', `particle ${i + 1} (id ${record.pdgId[i]}) has a non-finite momentum or mass`);
    text +=
      `${formatLheInteger(record.pdgId[i]!, 9)}${formatLheInteger(record.status[i]!, 3)}` +
      `${formatLheInteger(record.mother1[i]! + 1, 5)}${formatLheInteger(record.mother2[i]! + 1, 5)}` +
      `${formatLheInteger(record.colour1[i]!, 5)}${formatLheInteger(record.colour2[i]!, 5)} ` +
      `${formatLheReal(px)} ${formatLheReal(py)} ${formatLheReal(pz)} ${formatLheReal(e)} ${formatLheReal(m)} ` +
      `${formatLheReal(0, 4)} ${formatLheReal(record.spin[i]!, 4)}\n`;
  }
  return `${text}</event>\n`;
}

/**
 * Streams an LHE file: the start on construction, one block per `writeEvent`,
 * the end and the atomic rename on `close()`.
 *
 * @example
 * const writer = new LheWriter('out/signal.lhe', init, { model: 'doublet-benchmark', settings: { seed: 1 } });
 * // for each event: writer.writeEvent(record)
 * writer.close(); // the file appears now
 */
export class LheWriter {
  readonly file: string;
  private readonly out: AtomicFileWriter;
  private buffer = '';
  private count = 0;

  constructor(file: string, init: LheInit, header: LheHeaderInfo) {
    this.file = file;
    this.out = new AtomicFileWriter(file);
    this.buffer = formatLheStart(init, header);
  }

  /** Events written so far. */
  get events(): number {
    return this.count;
  }

  writeEvent(record: EventRecord): void {
    try {
      this.buffer += formatLheEvent(record);
    } catch (error) {
      this.abort();
      throw error instanceof TamisError ? error.withLocation({ file: this.file }) : error;
    }
    this.count++;
    if (this.buffer.length > FLUSH_CHARACTERS) this.flush();
  }

  /** Writes the closing tag and moves the file into place. */
  close(): void {
    this.buffer += LHE_END;
    this.flush();
    this.out.commit();
  }

  /** Removes the partial file. */
  abort(): void {
    this.buffer = '';
    this.out.abort();
  }

  private flush(): void {
    if (this.buffer.length === 0) return;
    this.out.write(this.buffer);
    this.buffer = '';
  }
}
