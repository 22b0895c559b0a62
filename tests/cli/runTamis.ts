/** Running the real `tamis` binary (compiled by `npm test`'s build step) in end-to-end tests. */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export const ROOT = join(import.meta.dirname, '..', '..');
export const BIN = join(ROOT, 'bin', 'tamis.js');

export interface TamisRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function requireBuild(): void {
  if (!existsSync(join(ROOT, 'dist', 'src', 'cli', 'index.js'))) {
    throw new Error('dist/ is missing: run `npm run build` (npm test does it) before the end-to-end tests');
  }
}

/** Runs `tamis ...args` synchronously in `cwd`. */
export function tamis(cwd: string, ...args: string[]): TamisRun {
  const run = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', cwd, env: { ...process.env, FORCE_COLOR: '0' } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** Starts `tamis ...args` without waiting (for kill tests). */
export function startTamis(cwd: string, ...args: string[]) {
  return spawn(process.execPath, [BIN, ...args], { cwd, stdio: 'ignore' });
}
