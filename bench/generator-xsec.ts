/**
 * Figures of the cross sections and of the hard-event sampler, on the invented
 * demo benchmark at 13 TeV with the built-in densities (built before timing):
 * - xsec_time_to_0.5pct: `crossSection` with the default 0.5% target per channel,
 *   scale band included (median of 3 runs after a warm-up), wall clock and CPU time;
 * - hard_sampler_prepare_time: integration plus maximum-weight search of all channels;
 * - hard_events_rate: unweighted hard events (no decays), wall clock and per CPU-second;
 * - hard_unweighting_efficiency: accepted / tried points while generating.
 */
import { join } from 'node:path';
import { lesHouchesToyDensities } from '../src/physics/pdf/index.js';
import { RandomStream } from '../src/physics/random.js';
import { crossSection } from '../src/generator/crossSection.js';
import { EventRecord } from '../src/generator/eventRecord.js';
import { prepareHardSampler, type HardSampler } from '../src/generator/hardSampler.js';
import { loadModel } from '../src/generator/model/index.js';
import { ratePerSecond, secondsFor, type Benchmark } from './benchmark.js';

const MODEL_FILE = join(import.meta.dirname, '..', '..', 'data-demo', 'benchmark.model.yaml');

/** CPU seconds (user + system) of one call. */
function cpuSecondsFor(fn: () => void): number {
  const start = process.cpuUsage();
  fn();
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1e6;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

let cachedSampler: HardSampler | undefined;
function sampler(): HardSampler {
  cachedSampler ??= prepareHardSampler(loadModel(MODEL_FILE), { energyTeV: 13, seed: 1, pdf: lesHouchesToyDensities() });
  return cachedSampler;
}

function xsecTimes(clock: (fn: () => void) => number): number {
  const model = loadModel(MODEL_FILE);
  const pdf = lesHouchesToyDensities();
  crossSection(model, { energyTeV: 13, pdf, seed: 99 }); // warm-up
  return median([1, 2, 3].map((seed) => clock(() => crossSection(model, { energyTeV: 13, pdf, seed }))));
}

export const benchmarks: Benchmark[] = [
  { name: 'xsec_time_to_0.5pct', unit: 's', measure: () => xsecTimes(secondsFor) },
  { name: 'xsec_cpu_time_to_0.5pct', unit: 'cpu-s', measure: () => xsecTimes(cpuSecondsFor) },
  {
    name: 'hard_sampler_prepare_time',
    unit: 's',
    measure: () => {
      const model = loadModel(MODEL_FILE);
      const pdf = lesHouchesToyDensities();
      return secondsFor(() => prepareHardSampler(model, { energyTeV: 13, seed: 2, pdf }));
    },
  },
  {
    name: 'hard_events_rate',
    unit: 'events/s',
    measure: () => {
      const s = sampler();
      const record = new EventRecord();
      const rng = RandomStream.forStream(1, 1);
      return ratePerSecond((n) => {
        for (let i = 0; i < n; i++) s.fill(record, rng);
      }, 100_000);
    },
  },
  {
    name: 'hard_events_cpu_rate',
    unit: 'events/cpu-s',
    measure: () => {
      const s = sampler();
      const record = new EventRecord();
      const rng = RandomStream.forStream(1, 2);
      const n = 500_000;
      return n / cpuSecondsFor(() => {
        for (let i = 0; i < n; i++) s.fill(record, rng);
      });
    },
  },
  {
    name: 'hard_unweighting_efficiency',
    unit: 'accepted/trial',
    measure: () => {
      const { statistics } = sampler();
      return statistics.accepted / statistics.trials;
    },
  },
];
