/**
 * A small pool of worker threads that runs independent tasks and returns their
 * results in task order, whatever order they finish in. Results are therefore
 * merged in a fixed order, which keeps outputs byte-identical for any number
 * of workers. With one worker `runTasks` runs them in this thread (no start-up cost).
 */
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { TamisError, type TamisErrorCode } from '../errors.js';

/** What a worker sends back for one task. */
export type WorkerReply<R> = { id: number; result: R } | { id: number; error: SerialisedError };

export interface SerialisedError {
  code: TamisErrorCode;
  message: string;
  file?: string;
  line?: number;
  column?: number;
  key?: string;
  suggestion?: string;
}

/** Turns any thrown value into plain data that crosses a thread boundary. */
export function serialiseError(error: unknown): SerialisedError {
  if (error instanceof TamisError) {
    const out: SerialisedError = { code: error.code, message: error.message };
    if (error.file !== undefined) out.file = error.file;
    if (error.line !== undefined) out.line = error.line;
    if (error.column !== undefined) out.column = error.column;
    if (error.key !== undefined) out.key = error.key;
    if (error.suggestion !== undefined) out.suggestion = error.suggestion;
    return out;
  }
  return { code: 'internal', message: error instanceof Error ? `${error.message}\n${error.stack ?? ''}` : String(error) };
}

export function deserialiseError(e: SerialisedError): TamisError {
  const { code, message, ...location } = e;
  return new TamisError(code, message, location);
}

/**
 * URL of a compiled module under dist/ for a module path relative to src/
 * (e.g. 'recast/recastWorker.js'). Worker threads need JavaScript: when this
 * code itself runs from TypeScript sources (tests), the compiled copy is used.
 */
export function compiledModuleUrl(pathFromSrc: string): URL {
  const here = fileURLToPath(import.meta.url);
  if (here.endsWith('.js')) return pathToFileURL(join(dirname(here), '..', pathFromSrc));
  let root = dirname(here);
  while (!existsSync(join(root, 'package.json')) && dirname(root) !== root) root = dirname(root);
  const compiled = join(root, 'dist', 'src', pathFromSrc);
  if (!existsSync(compiled)) {
    throw new TamisError('internal', `compiled worker ${compiled} is missing`, { suggestion: 'run npm run build first' });
  }
  return pathToFileURL(compiled);
}

export interface TaskRun<T, R> {
  tasks: readonly T[];
  /** Number of worker threads; 1 runs every task in this thread with `handle`. */
  workers: number;
  /** Compiled module that calls `serveTasks(handle)` with the same handler. */
  script: () => URL;
  /** The task handler, used directly when `workers` is 1. */
  handle: (task: T) => R | Promise<R>;
  /** Called as each result arrives (progress bars, checkpoints). */
  onResult?: (index: number, result: R) => void;
  /**
   * Tasks with the same key share expensive per-thread state (e.g. a prepared
   * event generator): a thread takes the next task of its last key while one
   * remains. Results are still returned in task order.
   */
  affinity?: (task: T) => string;
}

/**
 * Runs tasks on up to `workers` threads (or in this thread for one worker) and
 * returns the results in task order.
 */
export async function runTasks<T, R>(run: TaskRun<T, R>): Promise<R[]> {
  const { tasks, workers, onResult } = run;
  if (workers <= 1 || tasks.length <= 1) {
    const results: R[] = [];
    for (let i = 0; i < tasks.length; i++) {
      const result = await run.handle(tasks[i]!);
      results.push(result);
      onResult?.(i, result);
    }
    return results;
  }
  return runOnWorkers(run.script(), tasks, workers, onResult, run.affinity);
}

/**
 * Runs `tasks` on up to `workers` threads of `script` (a module that calls
 * `serveTasks`), returning results in task order.
 */
export async function runOnWorkers<T, R>(
  script: URL,
  tasks: readonly T[],
  workers: number,
  onResult?: (index: number, result: R) => void,
  affinity?: (task: T) => string,
): Promise<R[]> {
  const results = new Array<R>(tasks.length);
  if (tasks.length === 0) return results;
  const size = Math.max(1, Math.min(workers, tasks.length));
  const keys = tasks.map((t) => (affinity ? affinity(t) : ''));
  const pending = new Set(tasks.map((_, i) => i));
  const lastKey = new Map<Worker, string>();
  // Thread k starts on the k-th distinct key when there are several.
  const distinct = [...new Set(keys)];
  let started = 0;
  const takeTask = (worker: Worker): number | undefined => {
    let wanted = lastKey.get(worker);
    if (wanted === undefined && distinct.length > 1) wanted = distinct[started++ % distinct.length];
    let chosen: number | undefined;
    for (const i of pending) {
      if (wanted === undefined || keys[i] === wanted) {
        chosen = i;
        break;
      }
    }
    if (chosen === undefined) chosen = pending.values().next().value;
    if (chosen !== undefined) {
      pending.delete(chosen);
      lastKey.set(worker, keys[chosen]!);
    }
    return chosen;
  };
  let failed: TamisError | undefined;
  const threads: Worker[] = [];
  await new Promise<void>((resolve, reject) => {
    let running = 0;
    const finish = (): void => {
      if (running === 0) {
        if (failed) reject(failed);
        else resolve();
      }
    };
    const feed = (worker: Worker): void => {
      const id = failed ? undefined : takeTask(worker);
      if (id === undefined) {
        running--;
        void worker.terminate();
        finish();
        return;
      }
      worker.postMessage({ id, task: tasks[id] });
    };
    for (let k = 0; k < size; k++) {
      const worker = new Worker(script);
      threads.push(worker);
      running++;
      worker.on('message', (reply: WorkerReply<R>) => {
        if ('error' in reply) failed ??= deserialiseError(reply.error);
        else {
          results[reply.id] = reply.result;
          onResult?.(reply.id, reply.result);
        }
        feed(worker);
      });
      worker.on('error', (error) => {
        failed ??= new TamisError('internal', `worker thread failed: ${error.message}`);
        running--;
        finish();
      });
      feed(worker);
    }
  }).finally(() => {
    for (const t of threads) void t.terminate();
  });
  return results;
}
