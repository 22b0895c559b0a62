/**
 * Figures of the selection: the four demo analyses on realistic
 * reconstructed events, alone and together with the detector.
 *
 * Events: synthetic parton-level final states like those of the signals tamis
 * is built for (pairs of new states decaying to leptons, taus, b and light
 * quarks, neutrinos), reconstructed by the shipped 8 and 13 TeV detector
 * profiles. Every event goes through both eras: the 8 TeV detector feeds the
 * two 8 TeV analyses, the 13 TeV detector the two 13 TeV ones.
 */
import { createDetector } from '../src/detector/detector.js';
import { loadDetectorProfile } from '../src/detector/profile/loader.js';
import { RecoEvent } from '../src/detector/recoEvent.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from '../src/generator/eventRecord.js';
import { M_TAU } from '../src/physics/constants.js';
import { setPtEtaPhiM } from '../src/physics/fourVector.js';
import { RandomStream } from '../src/physics/random.js';
import { createSelection } from '../src/selection/engine.js';
import { loadAnalyses } from '../src/selection/loader.js';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { ratePerSecond, type Benchmark } from './benchmark.js';

const POOL = 128;
const scratch = new Float64Array(4);

function add(record: EventRecord, id: number, status: number, mother: number, pt: number, eta: number, phi: number, mass = 0): number {
  setPtEtaPhiM(scratch, 0, pt, eta, phi, mass);
  return record.add(id, status, mother, mother, scratch[0]!, scratch[1]!, scratch[2]!, scratch[3]!, mass);
}

/** One synthetic signal-like event: 1-4 light leptons, 0-2 hadronic taus, 2-5 quarks (b among them), neutrinos. */
function syntheticEvent(rng: RandomStream): EventRecord {
  const record = new EventRecord();
  record.add(2, STATUS_INCOMING, -1, -1, 0, 0, 800, 800, 0);
  record.add(-2, STATUS_INCOMING, -1, -1, 0, 0, -800, 800, 0);
  const pt = () => 15 + 120 * rng.exponential() * 0.5;
  const eta = () => rng.uniformIn(-2.8, 2.8);
  const phi = () => rng.uniformIn(-Math.PI, Math.PI);
  const sign = () => (rng.uniform() < 0.5 ? 1 : -1);
  const nLeptons = 1 + rng.integerBelow(4);
  for (let i = 0; i < nLeptons; i++) add(record, sign() * (rng.uniform() < 0.5 ? 11 : 13), STATUS_FINAL, 0, pt(), eta(), phi());
  const nTaus = rng.integerBelow(3);
  for (let i = 0; i < nTaus; i++) {
    const visible = pt();
    const e = eta();
    const p = phi();
    const s = sign();
    const tau = add(record, s * 15, STATUS_DECAYED, 0, 1.4 * visible, e, p, M_TAU);
    add(record, -s * 211, STATUS_FINAL, tau, visible, e, p, 0.14);
    add(record, s * 16, STATUS_FINAL, tau, 0.4 * visible, e, p);
  }
  const nQuarks = 2 + rng.integerBelow(4);
  for (let i = 0; i < nQuarks; i++) add(record, sign() * (rng.uniform() < 0.4 ? 5 : 1 + rng.integerBelow(4)), STATUS_FINAL, 0, pt(), eta(), phi(), 0);
  const nNeutrinos = rng.integerBelow(3);
  for (let i = 0; i < nNeutrinos; i++) add(record, sign() * 12, STATUS_FINAL, 0, pt(), eta(), phi());
  return record;
}

interface Setup {
  records: EventRecord[];
  eras: { detector: ReturnType<typeof createDetector>; selection: ReturnType<typeof createSelection>; pool: RecoEvent[] }[];
}

let setup: Setup | undefined;

function prepare(): Setup {
  if (setup !== undefined) return setup;
  const rng = RandomStream.forStream(2024, 7);
  const records = Array.from({ length: POOL }, () => syntheticEvent(rng));
  const analyses = loadAnalyses([new URL('../../analyses', import.meta.url).pathname]);
  const byDetector = new Map<string, typeof analyses>();
  for (const a of analyses) byDetector.set(a.detectorFile, [...(byDetector.get(a.detectorFile) ?? []), a]);
  const eras = [...byDetector].map(([file, group]) => {
    const detector = createDetector(loadDetectorProfile(file));
    const pool = records.map((record) => {
      const reco = new RecoEvent();
      detector.reconstruct(record, rng, reco);
      return reco;
    });
    return { detector, selection: createSelection(group), pool };
  });
  setup = { records, eras };
  return setup;
}

/**
 * Like `ratePerSecond`, but per second of this process's CPU time: the
 * "per core" figure, less sensitive than wall time to other programs
 * sharing the machine.
 */
function ratePerCpuSecond(fn: (batch: number) => void, batch: number, minSeconds = 0.5): number {
  fn(batch);
  let items = 0;
  const start = process.cpuUsage();
  let elapsed = 0;
  while (elapsed < minSeconds) {
    fn(batch);
    items += batch;
    const used = process.cpuUsage(start);
    elapsed = (used.user + used.system) / 1e6;
  }
  return items / elapsed;
}

/** A garbage-collection trigger (the usual way to reach V8's gc() without a command-line flag). */
function collector(): () => void {
  setFlagsFromString('--expose-gc');
  return runInNewContext('gc') as () => void;
}

export const benchmarks: Benchmark[] = [
  ...(['', '_cpu'] as const).map(
    (suffix): Benchmark => ({
      name: `selection_rate_four_analyses${suffix}`,
      unit: suffix === '' ? 'events/s' : 'events/cpu-s',
      measure: () => {
        const { eras } = prepare();
        let i = 0;
        const rate = suffix === '' ? ratePerSecond : ratePerCpuSecond;
        return rate((n) => {
          for (let k = 0; k < n; k++, i++) {
            for (let e = 0; e < eras.length; e++) eras[e]!.selection.process(eras[e]!.pool[i & (POOL - 1)]!);
          }
        }, 100_000);
      },
    }),
  ),
  {
    // Streaming: the heap after 1 000 000 events minus the heap after 100 000, per extra event; 0 means flat.
    name: 'selection_heap_growth_per_event',
    unit: 'bytes/event',
    measure: () => {
      const { eras } = prepare();
      const gc = collector();
      const selection = createSelection(eras.flatMap((e) => e.selection.analyses));
      const pool = eras[0]!.pool;
      const run = (n: number) => {
        for (let i = 0; i < n; i++) selection.process(pool[i & (POOL - 1)]!);
      };
      run(100_000);
      gc();
      const before = process.memoryUsage().heapUsed;
      run(900_000);
      gc();
      return (process.memoryUsage().heapUsed - before) / 900_000;
    },
  },
  ...(['', '_cpu'] as const).map(
    (suffix): Benchmark => ({
      name: `detector_plus_selection_rate${suffix}`,
      unit: suffix === '' ? 'events/s' : 'events/cpu-s',
      measure: () => {
        const { records, eras } = prepare();
        const rng = RandomStream.forStream(2024, 8);
        const reco = new RecoEvent();
        let i = 0;
        const rate = suffix === '' ? ratePerSecond : ratePerCpuSecond;
        return rate((n) => {
          for (let k = 0; k < n; k++, i++) {
            const record = records[i & (POOL - 1)]!;
            for (let e = 0; e < eras.length; e++) {
              eras[e]!.detector.reconstruct(record, rng, reco);
              eras[e]!.selection.process(reco);
            }
          }
        }, 50_000);
      },
    }),
  ),
];
