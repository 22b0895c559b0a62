/**
 * Figures of event generation with decays and of event files. Generation
 * rates are per core: events divided by the CPU time of the process (user +
 * system), so a busy machine does not lower them; file rates use wall time
 * (they include the disk).
 * - events_with_decays_rate: unweighted events of the demo model at 13 TeV with full decay chains (hard sampler + decays, no output), per core;
 * - decay_chain_rate: decay chains alone, on hand-made pairs of the demo model's new particles;
 * - lhe_write_rate / lhe_read_rate: Les Houches Event files written to and read from a temporary folder.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { twoBodyDecay } from '../src/physics/phaseSpace.js';
import { RandomStream } from '../src/physics/random.js';
import { createDecayer } from '../src/generator/decays/index.js';
import { EventRecord, STATUS_FINAL, STATUS_INCOMING } from '../src/generator/eventRecord.js';
import { EVENTS_PER_CHUNK, prepareEventGeneration } from '../src/generator/generateEvents.js';
import { LheWriter, readLheFile } from '../src/generator/lhe/index.js';
import { loadModel } from '../src/generator/model/index.js';
import { lheInitOf } from '../src/generator/writeEventFile.js';
import { ratePerSecond, type Benchmark } from './benchmark.js';

/** CPU seconds used by this process so far. */
function cpuSeconds(): number {
  const { user, system } = process.cpuUsage();
  return (user + system) / 1e6;
}

/** Like ratePerSecond, but items per CPU second (one warm-up call, then at least `minSeconds` of CPU). */
function ratePerCpuSecond(fn: (batch: number) => void, batch: number, minSeconds = 1): number {
  fn(batch);
  let items = 0;
  const start = cpuSeconds();
  let used = 0;
  while (used < minSeconds) {
    fn(batch);
    items += batch;
    used = cpuSeconds() - start;
  }
  return items / used;
}

const MODEL_FILE = join(import.meta.dirname, '..', '..', 'data-demo', 'benchmark.model.yaml');
let sink = 0;

/** q qbar -> X Y at sqrt(s_hat) = 1.5 (mX + mY), produced at a random angle and boosted along z. */
function fillPair(record: EventRecord, idX: number, mX: number, idY: number, mY: number, rng: RandomStream, scratch: Float64Array): void {
  record.clear();
  const rootS = 1.5 * (mX + mY);
  const pz = (rng.uniform() - 0.5) * rootS;
  const e = Math.hypot(rootS, pz);
  record.add(2, STATUS_INCOMING, -1, -1, 0, 0, (e + pz) / 2, (e + pz) / 2, 0);
  record.add(-2, STATUS_INCOMING, -1, -1, 0, 0, (pz - e) / 2, (e - pz) / 2, 0);
  scratch[2] = pz;
  scratch[3] = e;
  twoBodyDecay(scratch, 0, mX, mY, 2 * rng.uniform() - 1, 2 * Math.PI * rng.uniform() - Math.PI, scratch, 1, 2);
  record.add(idX, STATUS_FINAL, 0, 1, scratch[4]!, scratch[5]!, scratch[6]!, scratch[7]!, mX);
  record.add(idY, STATUS_FINAL, 0, 1, scratch[8]!, scratch[9]!, scratch[10]!, scratch[11]!, mY);
}

export const benchmarks: Benchmark[] = [
  {
    name: 'events_with_decays_rate',
    unit: 'events/cpu-s',
    measure: () => {
      const model = loadModel(MODEL_FILE);
      const generator = prepareEventGeneration(model, { energyTeV: 13, events: 1000 * EVENTS_PER_CHUNK, seed: 1 });
      let chunk = 0;
      return ratePerCpuSecond(() => {
        generator.generateChunks(chunk, chunk + 1, (record) => (sink += record.size));
        chunk = (chunk + 1) % generator.chunkCount;
      }, EVENTS_PER_CHUNK);
    },
  },
  {
    name: 'decay_chain_rate',
    unit: 'events/cpu-s',
    measure: () => {
      const model = loadModel(MODEL_FILE);
      const decayer = createDecayer(model.particles, model.decayTables);
      const [a, b] = model.newParticles;
      const pairs: [number, number, number, number][] = [
        [a!.id, a!.mass, -a!.id, a!.mass],
        [b!.id, b!.mass, -b!.id, b!.mass],
        [a!.id, a!.mass, -b!.id, b!.mass],
      ];
      const record = new EventRecord();
      const rng = RandomStream.forStream(2);
      const scratch = new Float64Array(12);
      return ratePerCpuSecond((n) => {
        for (let k = 0; k < n; k++) {
          const [x, mx, y, my] = pairs[k % 3]!;
          fillPair(record, x, mx, y, my, rng, scratch);
          decayer.decayAll(record, rng);
          sink += record.size;
        }
      }, 100_000);
    },
  },
  {
    name: 'lhe_write_rate',
    unit: 'events/s',
    measure: () => {
      const { generator, events } = sampleEvents(2000);
      const folder = mkdtempSync(join(tmpdir(), 'tamis-bench-'));
      try {
        return ratePerSecond((n) => {
          const writer = new LheWriter(join(folder, 'bench.lhe'), lheInitOf(generator), { model: 'bench' });
          for (let k = 0; k < n; k++) writer.writeEvent(events[k % events.length]!);
          writer.close();
        }, 20_000);
      } finally {
        rmSync(folder, { recursive: true, force: true });
      }
    },
  },
  {
    name: 'lhe_read_rate',
    unit: 'events/s',
    measure: async () => {
      const { generator, events } = sampleEvents(2000);
      const folder = mkdtempSync(join(tmpdir(), 'tamis-bench-'));
      try {
        const file = join(folder, 'bench.lhe');
        const writer = new LheWriter(file, lheInitOf(generator), { model: 'bench' });
        const total = 100_000;
        for (let k = 0; k < total; k++) writer.writeEvent(events[k % events.length]!);
        writer.close();
        await readLheFile(file, (r) => (sink += r.size)); // warm-up
        const start = process.hrtime.bigint();
        await readLheFile(file, (r) => (sink += r.size));
        return total / (Number(process.hrtime.bigint() - start) / 1e9);
      } finally {
        rmSync(folder, { recursive: true, force: true });
      }
    },
  },
];

/** Decayed events of the demo model, kept in memory for the file figures. */
function sampleEvents(n: number): { generator: ReturnType<typeof prepareEventGeneration>; events: EventRecord[] } {
  const generator = prepareEventGeneration(loadModel(MODEL_FILE), { energyTeV: 13, events: n, seed: 3 });
  const events: EventRecord[] = [];
  generator.generateChunks(0, generator.chunkCount, (record) => events.push(record.copy()));
  return { generator, events };
}

export function keepAlive(): number {
  return sink;
}
