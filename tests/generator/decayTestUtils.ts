/**
 * Helpers of the decay tests: hand-made events and the consistency checks
 * every decayed event must pass (energy-momentum conservation at each decay
 * vertex and overall, on-shell masses, mother pointers, colour singlets).
 */
import { expect } from 'vitest';
import { mass2 } from '../../src/physics/fourVector.js';
import { twoBodyDecay } from '../../src/physics/phaseSpace.js';
import type { RandomStream } from '../../src/physics/random.js';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from '../../src/generator/eventRecord.js';
import { ParticleTable, STANDARD_MODEL_PARTICLES, type DecayTable, type ParticleInfo } from '../../src/generator/particles.js';

/** Invented test particles (not a model of tamis's demo): a heavy lepton, a charged scalar, a coloured scalar. */
export const HEAVY_LEPTON: ParticleInfo = { id: 9000011, name: 'L-', mass: 600, width: 0, charge: -1, twiceSpin: 1, colour: 1, selfConjugate: false };
export const CHARGED_SCALAR: ParticleInfo = { id: 9000037, name: 'S+', mass: 800, width: 0, charge: 1, twiceSpin: 0, colour: 1, selfConjugate: false };
export const COLOURED_SCALAR: ParticleInfo = { id: 9000042, name: 'X', mass: 900, width: 0, charge: -1 / 3, twiceSpin: 0, colour: 3, selfConjugate: false };

export const TEST_TABLES: readonly DecayTable[] = [
  {
    parent: HEAVY_LEPTON.id,
    channels: [
      { daughters: [23, 15], branching: 0.3 },
      { daughters: [-24, 16], branching: 0.3 },
      { daughters: [25, 15], branching: 0.25 },
      { daughters: [6, -5, 15], branching: 0.15 },
    ],
  },
  {
    parent: CHARGED_SCALAR.id,
    channels: [
      { daughters: [6, -5], branching: 0.4 },
      { daughters: [-15, 16], branching: 0.3 },
      { daughters: [6, -5, 25], branching: 0.3 },
    ],
  },
  { parent: COLOURED_SCALAR.id, channels: [{ daughters: [6, 15], branching: 1 }] },
];

export function testParticles(): ParticleTable {
  return new ParticleTable([...STANDARD_MODEL_PARTICLES, HEAVY_LEPTON, CHARGED_SCALAR, COLOURED_SCALAR]);
}

const scratch = new Float64Array(12);

/**
 * Fills `record` with q qbar -> A B: two incoming massless partons along the
 * beam with momentum fractions drawn from `rng`, and the produced pair
 * (status 1, mothers 0 and 1) with masses mA, mB at a random angle.
 */
export function makePairEvent(record: EventRecord, idA: number, mA: number, idB: number, mB: number, rng: RandomStream, colour = 0): void {
  record.clear();
  const sqrtS = 13000;
  const threshold = mA + mB;
  let x1: number;
  let x2: number;
  do {
    x1 = rng.uniform();
    x2 = rng.uniform();
  } while (x1 * x2 * sqrtS * sqrtS <= 1.0001 * threshold * threshold);
  const e1 = (x1 * sqrtS) / 2;
  const e2 = (x2 * sqrtS) / 2;
  record.add(2, STATUS_INCOMING, -1, -1, 0, 0, e1, e1, 0);
  record.add(-2, STATUS_INCOMING, -1, -1, 0, 0, -e2, e2, 0);
  scratch[0] = 0;
  scratch[1] = 0;
  scratch[2] = e1 - e2;
  scratch[3] = e1 + e2;
  twoBodyDecay(scratch, 0, mA, mB, 2 * rng.uniform() - 1, 2 * Math.PI * rng.uniform() - Math.PI, scratch, 1, 2);
  const a = record.add(idA, STATUS_FINAL, 0, 1, scratch[4]!, scratch[5]!, scratch[6]!, scratch[7]!, mA);
  const b = record.add(idB, STATUS_FINAL, 0, 1, scratch[8]!, scratch[9]!, scratch[10]!, scratch[11]!, mB);
  if (colour > 0) {
    // A coloured pair from q qbar: the quark's colour flows to A, the antiquark's anticolour to B.
    record.colour1[0] = colour;
    record.colour2[1] = colour;
    record.colour1[a] = colour;
    record.colour2[b] = colour;
  }
}

/** Daughter indices of `i` (first mother pointer). */
export function daughters(record: EventRecord, i: number): number[] {
  const out: number[] = [];
  for (let j = i + 1; j < record.size; j++) if (record.mother1[j] === i) out.push(j);
  return out;
}

/**
 * The checks of issue 3 on one decayed event: at every status-2 particle the
 * daughters' four-momenta sum to the parent's within `tolerance` (default
 * 1e-9) of the parent energy; the final state sums to the initial state within
 * `tolerance` of the total energy; every particle's four-momentum has its
 * recorded mass (m^2 within `tolerance` E^2); mothers point backwards; every
 * coloured final-state line closes. Events read back from an LHE file carry
 * ten significant digits (rounding up to 5e-10 per value), so they are checked
 * with tolerance 1e-8.
 */
export function expectConsistentEvent(record: EventRecord, tolerance = 1e-9): void {
  const p = record.momentum;
  const sumIn = [0, 0, 0, 0];
  const sumOut = [0, 0, 0, 0];
  for (let i = 0; i < record.size; i++) {
    const st = record.status[i]!;
    const e = p[4 * i + 3]!;
    const m = record.mass[i]!;
    const m2 = mass2(p, i);
    if (Math.abs(m2 - m * m) > tolerance * e * e) expect.fail(`particle ${i} (id ${record.pdgId[i]}): m^2 = ${m2}, recorded mass ${m}`);
    if (st === STATUS_INCOMING) for (let c = 0; c < 4; c++) sumIn[c]! += p[4 * i + c]!;
    if (st === STATUS_FINAL) for (let c = 0; c < 4; c++) sumOut[c]! += p[4 * i + c]!;
    if (st !== STATUS_INCOMING && record.mother1[i]! >= i) expect.fail(`particle ${i}: mother ${record.mother1[i]} does not come before it`);
    if (st === STATUS_DECAYED) {
      const ds = daughters(record, i);
      if (ds.length < 2) expect.fail(`decayed particle ${i} (id ${record.pdgId[i]}) has ${ds.length} daughters`);
      for (let c = 0; c < 4; c++) {
        let s = 0;
        for (const d of ds) s += p[4 * d + c]!;
        if (Math.abs(s - p[4 * i + c]!) > tolerance * e) expect.fail(`decay of particle ${i} (id ${record.pdgId[i]}) violates component ${c}: ${s} vs ${p[4 * i + c]}`);
      }
    }
  }
  for (let c = 0; c < 4; c++) {
    if (Math.abs(sumOut[c]! - sumIn[c]!) > tolerance * sumIn[3]!) expect.fail(`event violates component ${c}: out ${sumOut[c]} in ${sumIn[c]}`);
  }
  // Colour: in the whole event (incoming counted with colour and anticolour swapped) every tag opens once and closes once.
  const balance = new Map<number, number>();
  const bump = (tag: number, by: number): void => {
    if (tag !== 0) balance.set(tag, (balance.get(tag) ?? 0) + by);
  };
  for (let i = 0; i < record.size; i++) {
    const st = record.status[i]!;
    if (st === STATUS_FINAL) {
      bump(record.colour1[i]!, 1);
      bump(record.colour2[i]!, -1);
    } else if (st === STATUS_INCOMING) {
      bump(record.colour1[i]!, -1);
      bump(record.colour2[i]!, 1);
    }
  }
  for (const [tag, b] of balance) if (b !== 0) expect.fail(`colour tag ${tag} does not close (balance ${b})`);
}

/** Key naming a decay channel by its daughters' ids, as written in the record. */
export function channelKey(record: EventRecord, parent: number): string {
  return daughters(record, parent)
    .map((d) => record.pdgId[d])
    .join(' ');
}
