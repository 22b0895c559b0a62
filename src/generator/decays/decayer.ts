/**
 * Decay chains: every unstable particle of an event is decayed by its table,
 * recursively, until only stable particles are left with status 1.
 *
 * New particles decay by the model's tables (isotropic two-body, or flat
 * three-body); t, W, Z, h and tau by the built-in tables of builtinDecays.ts
 * with the special routines of topDecay.ts, higgsDecay.ts, tauDecay.ts and
 * tauHadrons.ts. A decayed particle gets status 2, its daughters are appended
 * with both mother pointers on it. Quarks, gluons, leptons, neutrinos, photons
 * and the visible tau-hadron systems are stable (no shower, no hadronisation).
 * Antiparticles decay to the charge-conjugate daughters.
 *
 * Intermediate t, W and Z get their pole masses (narrow-width approximation)
 * except the off-shell W and Z of Higgs decays. The decayer is deterministic
 * given the RandomStream it is passed and allocates nothing per event.
 */
import { TamisError } from '../../errors.js';
import { PDG } from '../../physics/constants.js';
import type { RandomStream } from '../../physics/random.js';
import { STATUS_DECAYED, STATUS_FINAL, type EventRecord } from '../eventRecord.js';
import { ParticleTable, type DecayTable } from '../particles.js';
import { BUILTIN_DECAY_TABLES } from './builtinDecays.js';
import { assignColours, FIRST_COLOUR_TAG } from './colourFlow.js';
import {
  compileDecays,
  KIND_HIGGS_VV,
  KIND_HIGGS_Z_GAMMA,
  KIND_TAU_HADRONIC,
  KIND_TAU_LEPTONIC,
  KIND_TOP,
  MAX_DAUGHTERS,
  type CompiledDecays,
} from './compileDecays.js';
import { sampleVectorPairMasses, sampleZGammaMass } from './higgsDecay.js';
import { boostFromRest, restMass, threeBodyFlatAtRest, twoBodyAtRest } from './restFrame.js';
import { sampleTauLeptonicAtRest } from './tauDecay.js';
import { sampleTauVisibleMass, TAU_OTHER_HADRONS } from './tauHadrons.js';
import { decayTopVA, TopDecayScratch } from './topDecay.js';

export interface DecayerOptions {
  /** Ids (either sign) left undecayed, e.g. [15] to keep taus. @default [] */
  stable?: readonly number[];
  /** Use the built-in t, W, Z, h, tau tables for parents without a table in `tables`. @default true */
  builtinTables?: boolean;
}

export interface Decayer {
  /** Decays every status-1 particle that has a table, and their products, in place. */
  decayAll(record: EventRecord, rng: RandomStream): void;
  /** Decays particle `index` (status 1) and its products; does nothing if it is stable. */
  decay(record: EventRecord, index: number, rng: RandomStream): void;
  /** True if particles with this id (either sign) are decayed. */
  decays(id: number): boolean;
  /** The tables in use, normalised, daughters in the order the decayer writes them. */
  readonly tables: readonly DecayTable[];
}

/** Ids below this are looked up in an array. */
const SMALL_IDS = 128;

/** Tries to find an open channel before declaring a parent too light for every channel. */
const MAX_CHANNEL_TRIES = 1000;

class ChainDecayer implements Decayer {
  private readonly c: CompiledDecays;
  private readonly wTable: number;
  private readonly vMasses = new Float64Array(2);
  private readonly topScratch = new TopDecayScratch();
  /** Rest-frame scratch: slots 1-3 hold the daughters in the parent rest frame. */
  private readonly rest = new Float64Array(16);
  private readonly particles: ParticleTable;
  private nextColour = FIRST_COLOUR_TAG;

  /** Table index by |id| for |id| < SMALL_IDS (-1 = stable): spares a Map lookup for SM particles. */
  private readonly smallIds = new Int32Array(SMALL_IDS).fill(-1);

  constructor(particles: ParticleTable, tables: readonly DecayTable[]) {
    this.particles = particles;
    this.c = compileDecays(particles, tables);
    this.wTable = this.c.tableOf.get(PDG.W) ?? -1;
    for (const [id, t] of this.c.tableOf) if (id < SMALL_IDS) this.smallIds[id] = t;
  }

  get tables(): readonly DecayTable[] {
    return this.c.tables;
  }

  decays(id: number): boolean {
    return this.c.tableOf.has(Math.abs(id));
  }

  decayAll(record: EventRecord, rng: RandomStream): void {
    this.nextColour = firstFreeColour(record);
    this.decayFrom(record, 0, rng);
  }

  decay(record: EventRecord, index: number, rng: RandomStream): void {
    if (index < 0 || index >= record.size) throw new TamisError('bad_input', `particle index ${index} is outside the event (size ${record.size})`);
    this.nextColour = firstFreeColour(record);
    const end = record.size;
    this.decayOne(record, index, rng);
    this.decayFrom(record, end, rng);
  }

  private decayFrom(record: EventRecord, start: number, rng: RandomStream): void {
    for (let i = start; i < record.size; i++) this.decayOne(record, i, rng);
  }

  private decayOne(record: EventRecord, i: number, rng: RandomStream): void {
    if (record.status[i] !== STATUS_FINAL) return;
    const id = record.pdgId[i]!;
    const absId = id < 0 ? -id : id;
    const t = absId < SMALL_IDS ? this.smallIds[absId]! : (this.c.tableOf.get(absId) ?? -1);
    if (t < 0) return;
    const c = this.c;
    const anti = id < 0 && c.parentSelfConjugate[t] === 0;
    const parentMass = restMass(record.momentum, i);
    const ch = this.pickChannel(t, parentMass, rng, record, i);
    const ids = anti ? c.idsConjugate : c.ids;
    const base = MAX_DAUGHTERS * ch;
    const n = c.count[ch]!;
    const kind = c.kind[ch]!;
    record.status[i] = STATUS_DECAYED;
    const first = record.size;
    if (kind === KIND_TOP) {
      this.decayTop(record, i, ids, ch, parentMass, rng);
      return;
    }
    // Daughter masses: the table's, or drawn for off-shell and visible-hadron systems.
    let m0 = c.masses[base]!;
    let m1 = c.masses[base + 1]!;
    const m2 = c.masses[base + 2]!;
    if (kind === KIND_HIGGS_VV) {
      const v = c.tableOf.get(Math.abs(ids[base]!));
      const info = this.particles.get(ids[base]!);
      sampleVectorPairMasses(parentMass, info.mass, info.width, v === undefined ? 0 : c.tableMinThreshold[v]!, rng, this.vMasses);
      m0 = this.vMasses[0]!;
      m1 = this.vMasses[1]!;
    } else if (kind === KIND_HIGGS_Z_GAMMA) {
      const v = c.tableOf.get(PDG.Z);
      const info = this.particles.get(PDG.Z);
      m0 = sampleZGammaMass(parentMass, info.mass, info.width, v === undefined ? 0 : c.tableMinThreshold[v]!, rng);
    } else if (kind === KIND_TAU_HADRONIC) {
      const visible = ids[base]!;
      m0 = sampleTauVisibleMass(visible < 0 ? -visible : visible, parentMass, rng);
    }
    record.add(ids[base]!, STATUS_FINAL, i, i, 0, 0, 0, 0, m0);
    record.add(ids[base + 1]!, STATUS_FINAL, i, i, 0, 0, 0, 0, m1);
    if (n === 3) record.add(ids[base + 2]!, STATUS_FINAL, i, i, 0, 0, 0, 0, m2);
    // Daughters in the parent rest frame, then boosted to the lab.
    const rest = this.rest;
    if (kind === KIND_TAU_LEPTONIC) {
      // Record order (l, nubar_l, nu_tau); the matrix element pairs l with nu_tau.
      sampleTauLeptonicAtRest(parentMass, m0, rng, rest, 1, 3, 2);
    } else {
      if (n === 3) {
        threeBodyFlatAtRest(rest, 1, 2, 3, parentMass, m0, m1, m2, rng);
      } else {
        twoBodyAtRest(rest, 1, 2, parentMass, m0, m1, 2 * rng.uniform() - 1, 2 * Math.PI * rng.uniform());
      }
    }
    const momentum = record.momentum;
    for (let k = 0; k < n; k++) boostFromRest(rest, k + 1, momentum, i, parentMass, momentum, first + k);
    this.nextColour = assignColours(c.colourPattern[ch]!, record.pdgId, record.colour1, record.colour2, i, first, n, c.colourOf, base, this.nextColour);
  }

  /** t -> q W, W -> fbar f in one go (the W decay angle is correlated with the top). */
  private decayTop(record: EventRecord, i: number, ids: Int32Array, ch: number, topMass: number, rng: RandomStream): void {
    const c = this.c;
    const base = MAX_DAUGHTERS * ch;
    const wId = ids[base + 1]!;
    const mq = c.masses[base]!;
    const mw = c.masses[base + 1]!;
    const wch = this.pickChannel(this.wTable, mw, rng, record, i);
    const wIds = wId < 0 ? c.idsConjugate : c.ids;
    const wBase = MAX_DAUGHTERS * wch;
    const m1 = c.masses[wBase]!;
    const m2 = c.masses[wBase + 1]!;
    const first = record.size;
    record.add(ids[base]!, STATUS_FINAL, i, i, 0, 0, 0, 0, mq);
    const w = record.add(wId, STATUS_DECAYED, i, i, 0, 0, 0, 0, mw);
    const f1 = record.add(wIds[wBase]!, STATUS_FINAL, w, w, 0, 0, 0, 0, m1);
    record.add(wIds[wBase + 1]!, STATUS_FINAL, w, w, 0, 0, 0, 0, m2);
    decayTopVA(record.momentum, i, topMass, mq, mw, m1, m2, rng, this.topScratch, first, w, f1, f1 + 1);
    this.nextColour = assignColours(c.colourPattern[ch]!, record.pdgId, record.colour1, record.colour2, i, first, 2, c.colourOf, base, this.nextColour);
    this.nextColour = assignColours(c.colourPattern[wch]!, record.pdgId, record.colour1, record.colour2, w, f1, 2, c.colourOf, wBase, this.nextColour);
  }

  /** Draws a channel of table t open at `parentMass`. */
  private pickChannel(t: number, parentMass: number, rng: RandomStream, record: EventRecord, i: number): number {
    const c = this.c;
    const first = c.tableFirst[t]!;
    const end = c.tableEnd[t]!;
    for (let attempt = 0; attempt < MAX_CHANNEL_TRIES; attempt++) {
      const u = rng.uniform();
      let ch = first;
      while (ch < end - 1 && u >= c.cumulative[ch]!) ch++;
      if (c.threshold[ch]! < parentMass) return ch;
    }
    throw new TamisError('physics', `no open decay channel for particle ${record.pdgId[i]} of mass ${parentMass} GeV`);
  }
}

/** The first colour tag not used in the event (at least 501). */
function firstFreeColour(record: EventRecord): number {
  let max = FIRST_COLOUR_TAG - 1;
  for (let i = 0; i < record.size; i++) {
    if (record.colour1[i]! > max) max = record.colour1[i]!;
    if (record.colour2[i]! > max) max = record.colour2[i]!;
  }
  return max + 1;
}

/**
 * Builds the decayer for a model's particles and decay tables. The built-in
 * tables (t, W, Z, h, tau) fill in every parent the model does not give a
 * table for; a model table for one of them replaces the built-in one.
 * Throws `bad_input`/`physics` TamisErrors for tables that cannot be used
 * (see compileDecays).
 *
 * @example
 * const decayer = createDecayer(new ParticleTable(), []);
 * decayer.decays(-15) // true: taus decay by the built-in table
 */
export function createDecayer(particles: ParticleTable, tables: readonly DecayTable[], options: DecayerOptions = {}): Decayer {
  const own = new ParticleTable([...particles.all(), ...(particles.has(TAU_OTHER_HADRONS.id) ? [] : [TAU_OTHER_HADRONS])]);
  const merged: DecayTable[] = [...tables];
  if (options.builtinTables ?? true) {
    for (const builtin of BUILTIN_DECAY_TABLES) if (!tables.some((t) => t.parent === builtin.parent)) merged.push(builtin);
  }
  const stable = new Set((options.stable ?? []).map((id) => Math.abs(id)));
  return new ChainDecayer(own, merged.filter((t) => !stable.has(t.parent)));
}
