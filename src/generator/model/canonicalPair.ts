/**
 * Puts a pair of particles produced by (or coupling to) one vector boson into
 * the canonical order the matrix elements assume:
 *
 * - a pair of total charge -1 is replaced by its charge conjugate (charge +1);
 * - fermions: a fermion and an antifermion, the fermion (positive id) first,
 *   because the current is ubar(first) Gamma v(second);
 * - neutral scalar pairs: a particle and its own antiparticle, the particle first;
 * - charged scalar pairs: kept in the order written, which fixes the sign of
 *   the current (k_first - k_second)^mu.
 */
import type { ParticleTable } from '../particles.js';

export interface CanonicalPair {
  first: number;
  second: number;
  /** 0 or 1 (units of e). */
  charge: 0 | 1;
  /** 0 scalars, 0.5 fermions. */
  spin: 0 | 0.5;
  /** True when the order was swapped: a scalar current (k_first - k_second) then changes sign. */
  swapped: boolean;
}

const CHARGE_TOLERANCE = 1e-9;

/** The canonical pair, or a lower-case message saying why the pair cannot couple to one vector. */
export function canonicalPair(a: number, b: number, table: ParticleTable): CanonicalPair | string {
  const pa = table.get(a);
  const pb = table.get(b);
  if (pa.twiceSpin !== pb.twiceSpin || pa.twiceSpin > 1) {
    return 'a vector boson couples to a pair of two scalars or of two fermions';
  }
  if (pa.colour !== 1 || pb.colour !== 1) return 'produced pairs must be colour singlets (leptons or new particles)';
  let total = table.charge(a) + table.charge(b);
  let first = a;
  let second = b;
  if (total < -0.5) {
    first = table.conjugate(a);
    second = table.conjugate(b);
    total = -total;
  }
  let charge: 0 | 1;
  if (Math.abs(total) < CHARGE_TOLERANCE) charge = 0;
  else if (Math.abs(total - 1) < CHARGE_TOLERANCE) charge = 1;
  else return `the pair has charge ${total}: a photon, Z or W gives charge 0 or +-1`;
  const spin: 0 | 0.5 = pa.twiceSpin === 0 ? 0 : 0.5;
  if (spin === 0.5) {
    if ((first > 0) === (second > 0)) return 'a fermion pair from a vector boson is a fermion and an antifermion';
    const swapped = first < 0;
    if (swapped) [first, second] = [second, first];
    if (charge === 0 && second !== -first) return 'a neutral fermion pair must be a particle and its own antiparticle, e.g. [E-, E+]';
    return { first, second, charge, spin, swapped };
  }
  if (charge === 0) {
    if (second !== table.conjugate(first) || table.get(first).selfConjugate) return 'a neutral scalar pair must be a particle and its own antiparticle, e.g. [S+, S-]';
    const swapped = first < 0;
    if (swapped) [first, second] = [second, first];
    return { first, second, charge, spin, swapped };
  }
  return { first, second, charge, spin, swapped: false };
}

/** Whether two canonical pairs are the same state; for scalars also whether the order is reversed. */
export function samePair(x: CanonicalPair, y: CanonicalPair): 'same' | 'reversed' | 'different' {
  if (x.first === y.first && x.second === y.second) return 'same';
  if (x.first === y.second && x.second === y.first) return 'reversed';
  return 'different';
}
