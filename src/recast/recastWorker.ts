/** Worker-thread entry of the recast: runs event chunks (see eventChunks.ts). */
import { runChunk } from './eventChunks.js';
import { serveTasks } from './serveTasks.js';

serveTasks(runChunk);
