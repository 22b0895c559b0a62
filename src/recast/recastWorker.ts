/** Worker-thread entry of the recast: event chunks (eventChunks.ts) and analysis limits (limitTask.ts). */
import { runChunk, type ChunkTask } from './eventChunks.js';
import { runLimitTask, type LimitTask } from './limitTask.js';
import { serveTasks } from './serveTasks.js';

serveTasks((task: ChunkTask | LimitTask) => (task.kind === 'limits' ? runLimitTask(task) : runChunk(task)));
