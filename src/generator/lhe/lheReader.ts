/**
 * Reading Les Houches Event files: streamed from disk in chunks (memory stays
 * flat for files of any size), gzip-compressed files recognised by their
 * magic bytes, or parsed from a string. See lheParser.ts for what is accepted
 * and rejected.
 */
import { createReadStream } from 'node:fs';
import { open } from 'node:fs/promises';
import { StringDecoder } from 'node:string_decoder';
import { createGunzip } from 'node:zlib';
import { TamisError } from '../../errors.js';
import { LheParser, type LheEventHandler, type LheReadResult } from './lheParser.js';

export interface LheReadOptions {
  /** Stop after this many events (the rest of the file is not checked). @default Infinity */
  maxEvents?: number;
}

/** A line longer than this is not LHE content (it protects memory against binary input). */
const MAX_LINE_CHARACTERS = 1 << 20;

/** Feeds the complete lines of `text` (after `carry`) to the parser; returns the unfinished tail. */
function feedLines(parser: LheParser, carry: string, text: string): string {
  let buffer = carry + text;
  let start = 0;
  for (;;) {
    const end = buffer.indexOf('\n', start);
    if (end < 0) break;
    parser.line(buffer.slice(start, end));
    if (parser.stopped) return '';
    start = end + 1;
  }
  buffer = buffer.slice(start);
  if (buffer.length > MAX_LINE_CHARACTERS) {
    throw new TamisError('bad_file', `line longer than ${MAX_LINE_CHARACTERS} characters: not a Les Houches Event file`, { file: parser.file });
  }
  return buffer;
}

/**
 * Parses LHE text held in memory (tests, small inputs); `file` names it in
 * error messages.
 *
 * @example
 * parseLheText(text, (record) => console.log(record.size)).events // number of events
 */
export function parseLheText(text: string, onEvent: LheEventHandler, options: LheReadOptions & { file?: string } = {}): LheReadResult {
  const parser = new LheParser(options.file ?? '<text>', onEvent, options.maxEvents);
  const tail = feedLines(parser, '', text);
  if (tail !== '' && !parser.stopped) parser.line(tail);
  return parser.end();
}

async function isGzip(file: string): Promise<boolean> {
  const handle = await open(file, 'r');
  try {
    const head = Buffer.alloc(2);
    const { bytesRead } = await handle.read(head, 0, 2, 0);
    return bytesRead === 2 && head[0] === 0x1f && head[1] === 0x8b;
  } finally {
    await handle.close();
  }
}

/**
 * Reads an LHE file (plain or gzip-compressed) and calls `onEvent` with a
 * reused EventRecord for each event, in file order. Resolves with the init
 * block and the number of events; rejects with a `bad_file` TamisError naming
 * the file and line for malformed content (see lheParser.ts), and for
 * unreadable or corrupt files.
 */
export async function readLheFile(file: string, onEvent: LheEventHandler, options: LheReadOptions = {}): Promise<LheReadResult> {
  const parser = new LheParser(file, onEvent, options.maxEvents);
  let gzip: boolean;
  try {
    gzip = await isGzip(file);
  } catch (error) {
    throw new TamisError('bad_file', `cannot read file: ${(error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (error as Error).message}`, { file });
  }
  const raw = createReadStream(file, { highWaterMark: 1 << 20 });
  const stream = gzip ? raw.pipe(createGunzip()) : raw;
  if (gzip) raw.on('error', (error) => stream.destroy(error));
  const decoder = new StringDecoder('utf8');
  let carry = '';
  // Errors of the parser and of `onEvent` pass through unchanged; stream errors become bad_file.
  let parsing = false;
  try {
    for await (const chunk of stream) {
      parsing = true;
      carry = feedLines(parser, carry, decoder.write(chunk as Buffer));
      parsing = false;
      if (parser.stopped) break;
    }
    parsing = true;
    if (!parser.stopped) {
      carry += decoder.end();
      if (carry !== '') parser.line(carry);
    }
  } catch (error) {
    if (parsing || error instanceof TamisError) throw error;
    const message = gzip ? `corrupt gzip data: ${(error as Error).message}` : `cannot read file: ${(error as Error).message}`;
    throw new TamisError('bad_file', message, { file });
  } finally {
    raw.destroy();
  }
  return parser.end();
}
