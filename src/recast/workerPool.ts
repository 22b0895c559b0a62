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

export interface PoolOptions<T, R> {
  /** Number of worker threads; 1 runs every task in this thread with `handle`. */
  workers: number;
  /** Compiled module that calls `serveTasks(handle)` with the same handler. */
  script: () => URL;
  /** The task handler, used directly when `workers` is 1. */
  handle: (task: T) => R | Promise<R>;
  /**
   * Tasks with the same key share expensive per-thread state (e.g. a prepared
   * event generator): an idle thread takes the oldest task of its last key
   * while one is queued, else the oldest task.
   */
  affinity?: (task: T) => string;
}

interface Queued<T, R> {
  task: T;
  key: string;
  resolve: (result: R) => void;
  reject: (error: unknown) => void;
}

/**
 * A pool of worker threads that takes tasks as they come (`submit`), so later
 * tasks can depend on earlier results; each result comes back through its own
 * promise. Threads start on the first submission and stop at `close()`.
 */
export class WorkerPool<T, R> {
  private readonly options: PoolOptions<T, R>;
  private readonly queue: Queued<T, R>[] = [];
  private readonly idle: Worker[] = [];
  private readonly threads: Worker[] = [];
  private readonly lastKey = new Map<Worker, string>();
  private readonly running = new Map<Worker, Queued<T, R>>();
  private failure: TamisError | undefined;
  private nextId = 0;

  constructor(options: PoolOptions<T, R>) {
    this.options = options;
  }

  /** Runs a task; resolves with its result, rejects with its error (or the pool's first failure). */
  submit(task: T): Promise<R> {
    if (this.failure) return Promise.reject(this.failure);
    if (this.options.workers <= 1) return Promise.resolve().then(() => this.options.handle(task));
    return new Promise<R>((resolve, reject) => {
      this.queue.push({ task, key: this.options.affinity?.(task) ?? '', resolve, reject });
      if (this.threads.length < this.options.workers) this.spawn();
      this.dispatch();
    });
  }

  /** Stops every thread. Tasks still queued are rejected. */
  async close(): Promise<void> {
    for (const q of this.queue.splice(0)) q.reject(new TamisError('internal', 'worker pool closed'));
    await Promise.all(this.threads.map((t) => t.terminate()));
    this.threads.length = 0;
    this.idle.length = 0;
  }

  private spawn(): void {
    const worker = new Worker(this.options.script());
    this.threads.push(worker);
    worker.on('message', (reply: WorkerReply<R>) => {
      const job = this.running.get(worker);
      this.running.delete(worker);
      if (job) {
        if ('error' in reply) this.fail(deserialiseError(reply.error), job);
        else job.resolve(reply.result);
      }
      this.idle.push(worker);
      this.dispatch();
    });
    worker.on('error', (error) => {
      const job = this.running.get(worker);
      this.running.delete(worker);
      this.fail(new TamisError('internal', `worker thread failed: ${error.message}`), job);
    });
    this.idle.push(worker);
  }

  private fail(error: TamisError, job: Queued<T, R> | undefined): void {
    this.failure ??= error;
    job?.reject(error);
    for (const q of this.queue.splice(0)) q.reject(this.failure);
  }

  private dispatch(): void {
    while (this.idle.length > 0 && this.queue.length > 0) {
      const worker = this.idle.shift()!;
      const wanted = this.lastKey.get(worker);
      let index = wanted === undefined ? -1 : this.queue.findIndex((q) => q.key === wanted);
      if (index < 0 && wanted === undefined) {
        // A fresh thread takes the oldest key no running thread works on, when there is one.
        const busy = new Set([...this.running.values()].map((q) => q.key));
        index = this.queue.findIndex((q) => !busy.has(q.key));
      }
      if (index < 0) index = 0;
      const job = this.queue.splice(index, 1)[0]!;
      this.lastKey.set(worker, job.key);
      this.running.set(worker, job);
      worker.postMessage({ id: this.nextId++, task: job.task });
    }
  }
}

export interface TaskRun<T, R> extends PoolOptions<T, R> {
  tasks: readonly T[];
  /** Called as each result arrives (progress bars, checkpoints). */
  onResult?: (index: number, result: R) => void;
}

/**
 * Runs tasks on up to `workers` threads (or in this thread for one worker) and
 * returns the results in task order.
 */
export async function runTasks<T, R>(run: TaskRun<T, R>): Promise<R[]> {
  const { tasks, onResult } = run;
  if (run.workers <= 1 || tasks.length <= 1) {
    const results: R[] = [];
    for (let i = 0; i < tasks.length; i++) {
      const result = await run.handle(tasks[i]!);
      results.push(result);
      onResult?.(i, result);
    }
    return results;
  }
  const pool = new WorkerPool<T, R>({ ...run, workers: Math.min(run.workers, tasks.length) });
  try {
    return await Promise.all(
      tasks.map((task, i) =>
        pool.submit(task).then((result) => {
          onResult?.(i, result);
          return result;
        }),
      ),
    );
  } finally {
    await pool.close();
  }
}
