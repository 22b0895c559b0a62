/** Worker-thread entry of scans: recasts whole scan points (see scan/scanPointTask.ts). */
import { runScanPoint } from './scan/scanPointTask.js';
import { serveTasks } from './serveTasks.js';

serveTasks(runScanPoint);
