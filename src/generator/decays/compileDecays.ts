/**
 * Compiles decay tables into flat typed arrays for the decayer's hot loop:
 * cumulative branching fractions, daughter ids for particle and antiparticle,
 * daughter masses, colour patterns and the decay routine ("kind") of each
 * channel. Done once per generator set-up; nothing here runs per event.
 */
import { TamisError } from '../../errors.js';
import { PDG } from '../../physics/constants.js';
import type { DecayChannel, DecayTable, ParticleTable } from '../particles.js';
import { colourPatternOf } from './colourFlow.js';
import { TAU_A1_MASS_MIN, TAU_OTHER_HADRONS_ID, TAU_OTHER_MASS_MIN, TAU_RHO_MASS_MIN } from './tauHadrons.js';

/** Isotropic two-body decay with the table masses. */
export const KIND_TWO_BODY = 0;
/** Three-body decay flat in phase space. */
export const KIND_THREE_BODY = 1;
/** t -> q W with the V-A correlation of the W decay (topDecay.ts). */
export const KIND_TOP = 2;
/** h -> W W* or Z Z* with off-shell masses (higgsDecay.ts). */
export const KIND_HIGGS_VV = 3;
/** h -> Z gamma with a Breit-Wigner Z mass (higgsDecay.ts). */
export const KIND_HIGGS_Z_GAMMA = 4;
/** tau -> l nu nu with the V-A matrix element (tauDecay.ts). */
export const KIND_TAU_LEPTONIC = 5;
/** tau -> nu + visible hadronic system with a sampled mass (tauHadrons.ts). */
export const KIND_TAU_HADRONIC = 6;

/** Largest number of daughters a channel may have. */
export const MAX_DAUGHTERS = 3;

export interface CompiledDecays {
  /** |parent id| -> table index. */
  readonly tableOf: Map<number, number>;
  readonly tables: readonly DecayTable[];
  readonly parentSelfConjugate: Uint8Array;
  /** Lightest channel threshold of each table, GeV (the lower edge for off-shell parents). */
  readonly tableMinThreshold: Float64Array;
  readonly tableFirst: Int32Array;
  readonly tableEnd: Int32Array;
  /** Cumulative branching fraction at the end of each channel (last of a table is exactly 1). */
  readonly cumulative: Float64Array;
  readonly kind: Uint8Array;
  readonly count: Uint8Array;
  /** Daughter ids, MAX_DAUGHTERS per channel, for the positive-id parent and for its antiparticle. */
  readonly ids: Int32Array;
  readonly idsConjugate: Int32Array;
  /** Daughter masses (GeV), MAX_DAUGHTERS per channel. */
  readonly masses: Float64Array;
  /** Colour representation (1, 3, 8) per daughter slot. */
  readonly colourOf: Uint8Array;
  readonly colourPattern: Uint8Array;
  /** Smallest parent mass (GeV) for which the channel is open. */
  readonly threshold: Float64Array;
}

const LEPTON_NEUTRINO: Record<number, number> = { [PDG.e]: PDG.nu_e, [PDG.mu]: PDG.nu_mu };

function channelLabel(particles: ParticleTable, parent: number, daughters: readonly number[]): string {
  const name = (id: number): string => (particles.has(id) ? (id < 0 && !particles.get(id).selfConjugate ? `anti-${particles.get(id).name}` : particles.get(id).name) : String(id));
  return `${name(parent)} -> ${daughters.map(name).join(' ')}`;
}

/** Picks the decay routine of a channel and puts its daughters in the order that routine expects. */
function classify(parent: number, daughters: readonly number[], wDecaysToTwo: boolean): { kind: number; order: number[] } {
  const has = (id: number): number => daughters.indexOf(id);
  if (parent === PDG.t && daughters.length === 2 && wDecaysToTwo) {
    const w = has(PDG.W);
    const q = 1 - w;
    if (w >= 0 && (daughters[q] === PDG.d || daughters[q] === PDG.s || daughters[q] === PDG.b)) return { kind: KIND_TOP, order: [q, w] };
  }
  if (parent === PDG.h && daughters.length === 2) {
    if (has(PDG.W) >= 0 && has(-PDG.W) >= 0) return { kind: KIND_HIGGS_VV, order: [has(PDG.W), has(-PDG.W)] };
    if (daughters[0] === PDG.Z && daughters[1] === PDG.Z) return { kind: KIND_HIGGS_VV, order: [0, 1] };
    if (has(PDG.Z) >= 0 && has(PDG.gamma) >= 0) return { kind: KIND_HIGGS_Z_GAMMA, order: [has(PDG.Z), has(PDG.gamma)] };
  }
  if (parent === PDG.tau && daughters.length === 3) {
    const nuTau = has(PDG.nu_tau);
    for (const lepton of [PDG.e, PDG.mu]) {
      const l = has(lepton);
      const nuBar = has(-LEPTON_NEUTRINO[lepton]!);
      if (nuTau >= 0 && l >= 0 && nuBar >= 0) return { kind: KIND_TAU_LEPTONIC, order: [l, nuBar, nuTau] };
    }
  }
  if (parent === PDG.tau && daughters.length === 2) {
    const nuTau = has(PDG.nu_tau);
    const v = 1 - nuTau;
    if (nuTau >= 0 && [-PDG.rho, -PDG.a1, -TAU_OTHER_HADRONS_ID].includes(daughters[v] ?? 0)) return { kind: KIND_TAU_HADRONIC, order: [v, nuTau] };
  }
  const order = daughters.map((_, k) => k);
  return { kind: daughters.length === 2 ? KIND_TWO_BODY : KIND_THREE_BODY, order };
}

function visibleMassMin(absId: number): number {
  return absId === PDG.rho ? TAU_RHO_MASS_MIN : absId === PDG.a1 ? TAU_A1_MASS_MIN : TAU_OTHER_MASS_MIN;
}

/**
 * Checks and compiles `tables` (one per parent; each must sum to 1 within
 * 1e-6 and is then normalised exactly). Throws `bad_input` for unknown
 * particles, bad branching fractions or unsupported channels and `physics`
 * for channels closed at the parent's pole mass.
 */
export function compileDecays(particles: ParticleTable, tables: readonly DecayTable[]): CompiledDecays {
  const tableOf = new Map<number, number>();
  tables.forEach((t, k) => {
    if (!particles.has(t.parent)) throw new TamisError('bad_input', `decay table for unknown particle id ${t.parent}`);
    if (t.parent <= 0) throw new TamisError('bad_input', `decay table parents use the positive id, got ${t.parent}`);
    if (tableOf.has(t.parent)) throw new TamisError('bad_input', `two decay tables for particle id ${t.parent}`);
    tableOf.set(t.parent, k);
  });
  // The V-A top routine decays the W itself, so it needs a W table of two-body channels.
  const wIndex = tableOf.get(PDG.W);
  const wDecaysToTwo = wIndex !== undefined && tables[wIndex]!.channels.every((ch) => ch.daughters.length === 2);
  const channelCount = tables.reduce((n, t) => n + t.channels.length, 0);
  const c = {
    parentSelfConjugate: new Uint8Array(tables.length),
    tableMinThreshold: new Float64Array(tables.length),
    tableFirst: new Int32Array(tables.length),
    tableEnd: new Int32Array(tables.length),
    cumulative: new Float64Array(channelCount),
    kind: new Uint8Array(channelCount),
    count: new Uint8Array(channelCount),
    ids: new Int32Array(MAX_DAUGHTERS * channelCount),
    idsConjugate: new Int32Array(MAX_DAUGHTERS * channelCount),
    masses: new Float64Array(MAX_DAUGHTERS * channelCount),
    colourOf: new Uint8Array(MAX_DAUGHTERS * channelCount),
    colourPattern: new Uint8Array(channelCount),
    threshold: new Float64Array(channelCount),
  };
  const normalised: DecayTable[] = [];
  let ch = 0;
  tables.forEach((table, t) => {
    const parentInfo = particles.get(table.parent);
    const parentName = parentInfo.name;
    c.parentSelfConjugate[t] = parentInfo.selfConjugate ? 1 : 0;
    if (table.channels.length === 0) throw new TamisError('bad_input', `decay table of ${parentName} has no channels`);
    let sum = 0;
    for (const channel of table.channels) {
      if (!(channel.branching >= 0) || !Number.isFinite(channel.branching)) {
        throw new TamisError('bad_input', `decay ${channelLabel(particles, table.parent, channel.daughters)}: branching fraction must be a number >= 0, got ${channel.branching}`);
      }
      sum += channel.branching;
    }
    if (Math.abs(sum - 1) > 1e-6) throw new TamisError('bad_input', `branching fractions of ${parentName} sum to ${sum}, not 1 (tolerance 1e-6)`);
    c.tableFirst[t] = ch;
    let running = 0;
    let minThreshold = Infinity;
    const reordered: DecayChannel[] = [];
    for (const channel of table.channels) {
      const label = channelLabel(particles, table.parent, channel.daughters);
      const n = channel.daughters.length;
      if (n < 2 || n > MAX_DAUGHTERS) throw new TamisError('bad_input', `decay ${label}: ${n} daughters; tamis decays to 2 or 3 particles`);
      for (const d of channel.daughters) if (!particles.has(d)) throw new TamisError('bad_input', `decay ${label}: unknown particle id ${d}`);
      const { kind, order } = classify(table.parent, channel.daughters, wDecaysToTwo);
      const daughters = order.map((k) => channel.daughters[k]!);
      reordered.push({ daughters, branching: channel.branching / sum });
      c.kind[ch] = kind;
      c.count[ch] = n;
      let massSum = 0;
      const colours: number[] = [];
      daughters.forEach((d, k) => {
        const info = particles.get(d);
        c.ids[MAX_DAUGHTERS * ch + k] = d;
        c.idsConjugate[MAX_DAUGHTERS * ch + k] = particles.conjugate(d);
        c.masses[MAX_DAUGHTERS * ch + k] = info.mass;
        c.colourOf[MAX_DAUGHTERS * ch + k] = info.colour;
        colours.push(info.colour);
        massSum += info.mass;
      });
      c.colourPattern[ch] = colourPatternOf(parentInfo.colour, daughters, colours, label);
      let threshold = massSum;
      if (kind === KIND_HIGGS_VV || kind === KIND_HIGGS_Z_GAMMA) threshold = 0; // off-shell V: any mass above the V's own lightest channel
      else if (kind === KIND_TAU_HADRONIC) threshold = visibleMassMin(-daughters[0]!) + particles.get(daughters[1]!).mass;
      c.threshold[ch] = threshold;
      if (kind !== KIND_HIGGS_VV && kind !== KIND_HIGGS_Z_GAMMA && parentInfo.mass < threshold) {
        throw new TamisError('physics', `decay ${label} is closed: ${parentInfo.mass} GeV is below the ${threshold} GeV of the daughters`);
      }
      minThreshold = Math.min(minThreshold, threshold);
      running += channel.branching / sum;
      c.cumulative[ch] = running;
      ch++;
    }
    c.cumulative[ch - 1] = 1;
    c.tableEnd[t] = ch;
    c.tableMinThreshold[t] = minThreshold;
    normalised.push({ parent: table.parent, channels: reordered });
  });
  // h -> V V*: the V's lightest channel bounds its mass from below.
  for (let k = 0; k < channelCount; k++) {
    if (c.kind[k] !== KIND_HIGGS_VV && c.kind[k] !== KIND_HIGGS_Z_GAMMA) continue;
    const v = tableOf.get(Math.abs(c.ids[MAX_DAUGHTERS * k]!));
    const vMin = v === undefined ? 0 : c.tableMinThreshold[v]!;
    c.threshold[k] = c.kind[k] === KIND_HIGGS_VV ? 2 * vMin : vMin;
  }
  return { tableOf, tables: normalised, ...c };
}
