/**
 * How the detector sees each final-state particle, by PDG id (PDG Monte Carlo
 * particle numbering scheme, Review of Particle Physics): invisible, electron,
 * muon, parton (becomes a jet), photon, hadron, or a particle that should have
 * been decayed before reaching the detector.
 */
import { TamisError } from '../errors.js';
import type { EventRecord } from '../generator/eventRecord.js';

export const KIND_UNKNOWN = 0;
export const KIND_INVISIBLE = 1;
export const KIND_ELECTRON = 2;
export const KIND_MUON = 3;
/** Quarks d, u, s, c, b and the gluon: each becomes a calorimeter deposit and then a jet. */
export const KIND_PARTON = 4;
export const KIND_PHOTON = 5;
/** Mesons and baryons: part of a tau's visible system when a tau is among their ancestors, else a calorimeter deposit. */
export const KIND_HADRON = 6;
/** Top, tau, W, Z and Higgs bosons: the generator decays them; finding one in the final state is an input error. */
export const KIND_UNDECAYED = 7;

/** Jet flavour labels, in increasing precedence when deposits merge into one jet. */
export const FLAVOUR_LIGHT = 0;
export const FLAVOUR_TAU = 1;
export const FLAVOUR_CHARM = 2;
export const FLAVOUR_BOTTOM = 3;

const SMALL_ID_KINDS = new Uint8Array(1000);
for (const id of [12, 14, 16]) SMALL_ID_KINDS[id] = KIND_INVISIBLE;
SMALL_ID_KINDS[11] = KIND_ELECTRON;
SMALL_ID_KINDS[13] = KIND_MUON;
for (const id of [1, 2, 3, 4, 5, 21]) SMALL_ID_KINDS[id] = KIND_PARTON;
SMALL_ID_KINDS[22] = KIND_PHOTON;
for (const id of [6, 15, 23, 24, 25]) SMALL_ID_KINDS[id] = KIND_UNDECAYED;
// Ids 81-100 are reserved for generator-specific pseudoparticles (PDG Monte Carlo numbering
// scheme; from memory); tamis's generator writes the lumped "other hadrons" system of a tau
// decay as 98 (generator/decays/tauHadrons.ts), so they are visible hadronic systems here.
// Three-digit ids from 100 up are mesons.
for (let id = 81; id < 1000; id++) SMALL_ID_KINDS[id] = KIND_HADRON;

/**
 * Stable neutral particles of common new-physics models that escape the detector:
 * sneutrinos (1000012, 1000014, 1000016), the lightest neutralino (1000022) and
 * the gravitino (1000039), in the PDG numbering of supersymmetric particles.
 */
const INVISIBLE_NEW_PARTICLES = new Set([1000012, 1000014, 1000016, 1000022, 1000039]);

/**
 * The detector kind of a particle with |PDG id| = `absId`.
 *
 * @example
 * particleKind(5) === KIND_PARTON // true
 */
export function particleKind(absId: number): number {
  if (absId < 1000) return SMALL_ID_KINDS[absId]!;
  if (INVISIBLE_NEW_PARTICLES.has(absId)) return KIND_INVISIBLE;
  // Four-digit ids (and the excited states 10000-999999 with the same last digits) are hadrons.
  if (absId < 1_000_000) return KIND_HADRON;
  return KIND_UNKNOWN;
}

/** Jet flavour of a parton: b, c or light (d, u, s, g). */
export function partonFlavour(absId: number): number {
  return absId === 5 ? FLAVOUR_BOTTOM : absId === 4 ? FLAVOUR_CHARM : FLAVOUR_LIGHT;
}

/**
 * Index of the tau a final-state hadron descends from (it is then part of that
 * tau's visible decay system), or -1. The search follows first mothers through
 * any intermediates (a W* written between tau and hadrons, a rho decayed to
 * pions), up to 16 generations.
 */
export function tauAncestor(record: EventRecord, i: number): number {
  let mother = record.mother1[i]!;
  for (let depth = 0; depth < 16 && mother >= 0 && mother < record.size; depth++) {
    const id = record.pdgId[mother]!;
    if (id === 15 || id === -15) return mother;
    mother = record.mother1[mother]!;
  }
  return -1;
}

/** The error for a final-state particle the detector cannot see (`kind` KIND_UNDECAYED or KIND_UNKNOWN). */
export function unseenParticleError(kind: number, id: number, index: number): TamisError {
  if (kind === KIND_UNDECAYED) {
    return new TamisError('bad_input', `final-state particle ${index} (PDG id ${id}) should have decayed before reaching the detector`, {
      suggestion: 'decay tops, taus, W, Z and Higgs bosons first (the generator\'s decay step does this, also for events read from files)',
    });
  }
  return new TamisError('bad_input', `final-state particle ${index} has PDG id ${id}, which the detector does not know how to see`, {
    suggestion: 'the detector sees leptons, quarks, gluons, photons, hadrons and invisible neutral particles; decay other particles first',
  });
}
