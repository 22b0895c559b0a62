/**
 * Figures of the parametrised detector: events per second through
 * `Detector.reconstruct` for a signal-like event (four charged leptons, four
 * jets of which two from b quarks, two neutrinos, with status-2 intermediates
 * as the generator writes them), for each shipped profile; also per second of
 * CPU time, the per-core figure when other processes share the machine.
 */
import { createDetector } from '../src/detector/detector.js';
import { findDetectorProfile } from '../src/detector/profile/builtInProfiles.js';
import { RecoEvent } from '../src/detector/recoEvent.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from '../src/generator/eventRecord.js';
import { setPtEtaPhiM } from '../src/physics/fourVector.js';
import { RandomStream } from '../src/physics/random.js';
import { ratePerSecond, type Benchmark } from './benchmark.js';

const POOL = 256;
const scratch = new Float64Array(4);

function add(record: EventRecord, id: number, status: number, mother: number, pt: number, eta: number, phi: number, m: number): number {
  setPtEtaPhiM(scratch, 0, pt, eta, phi, m);
  return record.add(id, status, mother, mother, scratch[0]!, scratch[1]!, scratch[2]!, scratch[3]!, m);
}

/** A pool of signal-like events with varied kinematics: two heavy states each giving two leptons, two jets and (one of them) neutrinos. */
function signalLikePool(): EventRecord[] {
  const rng = RandomStream.forStream(2024, 7);
  const pool: EventRecord[] = [];
  for (let k = 0; k < POOL; k++) {
    const r = new EventRecord(32);
    r.add(2, STATUS_INCOMING, -1, -1, 0, 0, 600, 600, 0);
    r.add(-2, STATUS_INCOMING, -1, -1, 0, 0, -400, 400, 0);
    const angle = () => rng.uniformIn(-Math.PI, Math.PI);
    const eta = () => rng.gaussian(0, 1.3);
    const pt = (scale: number) => scale * (0.3 + rng.exponential());
    const a = add(r, 9000011, STATUS_DECAYED, 0, pt(60), eta(), angle(), 500);
    const b = add(r, -9000011, STATUS_DECAYED, 0, pt(60), eta(), angle(), 500);
    const z = add(r, 23, STATUS_DECAYED, a, pt(80), eta(), angle(), 91.19);
    add(r, 11, STATUS_FINAL, z, pt(40), eta(), angle(), 0);
    add(r, -11, STATUS_FINAL, z, pt(40), eta(), angle(), 0);
    const t = add(r, 6, STATUS_DECAYED, a, pt(90), eta(), angle(), 172.57);
    add(r, 5, STATUS_FINAL, t, pt(50), eta(), angle(), 4.7);
    const w = add(r, 24, STATUS_DECAYED, t, pt(60), eta(), angle(), 80.37);
    add(r, -13, STATUS_FINAL, w, pt(35), eta(), angle(), 0.106);
    add(r, 14, STATUS_FINAL, w, pt(35), eta(), angle(), 0);
    const tb = add(r, -6, STATUS_DECAYED, b, pt(90), eta(), angle(), 172.57);
    add(r, -5, STATUS_FINAL, tb, pt(50), eta(), angle(), 4.7);
    const wb = add(r, -24, STATUS_DECAYED, tb, pt(60), eta(), angle(), 80.37);
    add(r, 13, STATUS_FINAL, wb, pt(35), eta(), angle(), 0.106);
    add(r, -14, STATUS_FINAL, wb, pt(35), eta(), angle(), 0);
    const h = add(r, 25, STATUS_DECAYED, b, pt(80), eta(), angle(), 125.2);
    add(r, 1, STATUS_FINAL, h, pt(45), eta(), angle(), 0);
    add(r, -2, STATUS_FINAL, h, pt(45), eta(), angle(), 0);
    pool.push(r);
  }
  return pool;
}

let sink = 0;

/** Reconstructs `n` events of the pool with `profileName`'s detector. */
function reconstructor(profileName: string): (n: number) => void {
  const detector = createDetector(findDetectorProfile(profileName));
  const pool = signalLikePool();
  const out = new RecoEvent();
  const rng = RandomStream.forStream(99, 1);
  return (n) => {
    for (let i = 0; i < n; i++) {
      detector.reconstruct(pool[i & (POOL - 1)]!, rng, out);
      sink += out.jets.size;
    }
  };
}

/**
 * Events per second of CPU time used by this process (user + system): the
 * per-core rate, unaffected by other processes competing for the cores.
 */
function cpuRatePerSecond(fn: (batch: number) => void, batch: number, minSeconds = 1): number {
  fn(batch); // warm-up
  const start = process.cpuUsage();
  let items = 0;
  let seconds = 0;
  while (seconds < minSeconds) {
    fn(batch);
    items += batch;
    const used = process.cpuUsage(start);
    seconds = (used.user + used.system) / 1e6;
  }
  return items / seconds;
}

export const benchmarks: Benchmark[] = [
  { name: 'detector_rate_8tev', unit: 'events/s', measure: () => ratePerSecond(reconstructor('generic-8tev'), 100_000, 1) },
  { name: 'detector_rate_13tev', unit: 'events/s', measure: () => ratePerSecond(reconstructor('generic-13tev'), 100_000, 1) },
  { name: 'detector_cpu_rate_8tev', unit: 'events/cpu-s', measure: () => cpuRatePerSecond(reconstructor('generic-8tev'), 100_000) },
];

export function keepAlive(): number {
  return sink;
}
