/**
 * Atomic output: every file tamis writes goes to a temporary sibling first and
 * is renamed into place, so a killed run never leaves a half-written file
 * (rename is atomic within one file system, POSIX rename(2)).
 */
import { mkdirSync, renameSync, rmSync, writeFileSync, openSync, writeSync, closeSync, fsyncSync, readdirSync, statSync } from 'node:fs';
import { dirname, basename, join } from 'node:path';
import { TamisError } from '../errors.js';

let counter = 0;

/** Temporary path beside `file`; the suffix is unique per process and call. */
export function temporaryPathFor(file: string): string {
  counter += 1;
  return join(dirname(file), `.${basename(file)}.${process.pid}.${counter}.tmp`);
}

/** Writes `data` to `file` atomically, creating parent folders. */
export function writeFileAtomic(file: string, data: string | Uint8Array): void {
  const tmp = temporaryPathFor(file);
  try {
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(tmp, data);
    renameSync(tmp, file);
  } catch (error) {
    rmSync(tmp, { force: true });
    throw new TamisError('io', `cannot write file: ${(error as Error).message}`, { file });
  }
}

/**
 * A file written in pieces (large LHE or CSV files) that appears under its
 * final name only when `commit()` is called; `abort()` removes the pieces.
 */
export class AtomicFileWriter {
  readonly file: string;
  private readonly tmp: string;
  private fd: number;
  private open = true;

  constructor(file: string) {
    this.file = file;
    this.tmp = temporaryPathFor(file);
    try {
      mkdirSync(dirname(file), { recursive: true });
      this.fd = openSync(this.tmp, 'w');
    } catch (error) {
      throw new TamisError('io', `cannot write file: ${(error as Error).message}`, { file });
    }
  }

  write(chunk: string): void {
    if (!this.open) throw new TamisError('internal', 'write after commit or abort', { file: this.file });
    try {
      writeSync(this.fd, chunk);
    } catch (error) {
      this.abort();
      throw new TamisError('io', `cannot write file: ${(error as Error).message}`, { file: this.file });
    }
  }

  commit(): void {
    if (!this.open) return;
    this.open = false;
    try {
      fsyncSync(this.fd);
      closeSync(this.fd);
      renameSync(this.tmp, this.file);
    } catch (error) {
      rmSync(this.tmp, { force: true });
      throw new TamisError('io', `cannot write file: ${(error as Error).message}`, { file: this.file });
    }
  }

  abort(): void {
    if (!this.open) return;
    this.open = false;
    try {
      closeSync(this.fd);
    } catch {
      // already closed
    }
    rmSync(this.tmp, { force: true });
  }
}

const TEMPORARY = /^\..+\.(\d+)\.\d+\.tmp$/;

/**
 * Removes the temporary files that a killed run left in `folder` (names made
 * by `temporaryPathFor`), when their process is gone and they are older than
 * `minAgeSeconds`. Returns how many were removed.
 */
export function removeStaleTemporaries(folder: string, minAgeSeconds = 60): number {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return 0;
  }
  let removed = 0;
  const now = Date.now();
  for (const name of names) {
    const match = TEMPORARY.exec(name);
    if (!match) continue;
    const pid = Number(match[1]);
    if (pid === process.pid || processIsAlive(pid)) continue;
    const file = join(folder, name);
    try {
      if (now - statSync(file).mtimeMs < minAgeSeconds * 1000) continue;
      rmSync(file, { force: true });
      removed++;
    } catch {
      // gone already
    }
  }
  return removed;
}

function processIsAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
