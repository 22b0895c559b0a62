/**
 * Figures of the recast workflow: one model point (2 energies x 4 analyses x
 * 100 000 events per energy on 2 worker threads, limits included) and the demo
 * scan. Wall-clock times.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { packageRoot } from '../src/io/packageRoot.js';
import { recastPoint } from '../src/recast/recastPoint.js';
import { runDemo } from '../src/recast/runDemo.js';
import { loadAnalyses } from '../src/selection/loader.js';
import type { Benchmark } from './benchmark.js';

const root = packageRoot();

async function seconds(run: () => Promise<unknown>): Promise<number> {
  const start = process.hrtime.bigint();
  await run();
  return Number(process.hrtime.bigint() - start) / 1e9;
}

export const benchmarks: Benchmark[] = [
  {
    name: 'recast_point_2x4x100k_2workers_time',
    unit: 's',
    measure: () => {
      const file = join(root, 'data-demo', 'benchmark.model.yaml');
      const analyses = loadAnalyses([join(root, 'analyses')]);
      return seconds(() => recastPoint({ model: { text: readFileSync(file, 'utf8'), file }, analyses, events: 100_000, seed: 1, workers: 2 }));
    },
  },
  {
    name: 'demo_2workers_time',
    unit: 's',
    measure: async () => {
      const out = mkdtempSync(join(tmpdir(), 'tamis-bench-demo-'));
      try {
        return await seconds(() => runDemo({ outFolder: out, workers: 2 }));
      } finally {
        rmSync(out, { recursive: true, force: true });
      }
    },
  },
];
