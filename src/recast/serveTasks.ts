/**
 * The worker side of `runOnWorkers`: answers each task message with its result
 * or a serialised error.
 */
import { parentPort } from 'node:worker_threads';
import { serialiseError, type WorkerReply } from './workerPool.js';

export function serveTasks<T, R>(handle: (task: T) => R | Promise<R>): void {
  const port = parentPort;
  if (port === null) throw new Error('serveTasks must run in a worker thread');
  port.on('message', async (message: { id: number; task: T }) => {
    let reply: WorkerReply<R>;
    try {
      reply = { id: message.id, result: await handle(message.task) };
    } catch (error) {
      reply = { id: message.id, error: serialiseError(error) };
    }
    port.postMessage(reply);
  });
}
