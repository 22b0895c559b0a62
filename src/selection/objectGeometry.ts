/**
 * Object-selection helpers on the detector's flat object lists: thresholds,
 * Delta R proximity, isolation cone sums and overlap removal, all on
 * keep-flag arrays without allocation.
 */
import type { ObjectList } from '../detector/recoEvent.js';
import type { KinematicThresholds } from './objects.js';

const TWO_PI = 2 * Math.PI;

/**
 * Whether two directions lie closer than Delta R = sqrt(cone2):
 * Delta R^2 = Delta eta^2 + Delta phi^2 with Delta phi folded into (-pi, pi]
 * (same as physics/fourVector deltaR, without the square root; azimuths are
 * in (-pi, pi], so one fold suffices).
 */
export function within(eta1: number, phi1: number, eta2: number, phi2: number, cone2: number): boolean {
  const dEta = eta1 - eta2;
  const dEta2 = dEta * dEta;
  if (dEta2 >= cone2) return false;
  let dPhi = phi1 - phi2;
  if (dPhi > Math.PI) dPhi -= TWO_PI;
  else if (dPhi <= -Math.PI) dPhi += TWO_PI;
  return dEta2 + dPhi * dPhi < cone2;
}

/**
 * Indices into an analysis's table of squared Delta R cones (`coneTable`):
 * cones travel as table indices, not as numbers, so that no floating-point
 * value crosses a function call in the hot loop (V8 would box it).
 */
export const CONE_TAUS_NEAR_LEPTONS = 0;
export const CONE_JETS_NEAR_LEPTONS = 1;
export const CONE_JETS_NEAR_TAUS = 2;
export const CONE_LEPTONS_NEAR_JETS = 3;

/** Whether object `i` of `list` lies within the cone `cones[which]` (squared) of any kept object of `others`. */
export function nearKept(list: ObjectList, i: number, others: ObjectList, keep: Uint8Array, cones: Float64Array, which: number): boolean {
  const eta = list.eta[i]!;
  const phi = list.phi[i]!;
  const cone2 = cones[which]!;
  const oEta = others.eta;
  const oPhi = others.phi;
  for (let j = 0; j < others.size; j++) {
    if (keep[j] === 1 && within(eta, phi, oEta[j]!, oPhi[j]!, cone2)) return true;
  }
  return false;
}

/** Sets keep[i] = 1 for objects passing the thresholds, 0 otherwise; returns how many pass. */
export function markThresholds(list: ObjectList, cuts: KinematicThresholds, keep: Uint8Array): number {
  let n = 0;
  const minPt = cuts.minPt;
  const maxAbsEta = cuts.maxAbsEta;
  for (let i = 0; i < list.size; i++) {
    const pass = list.pt[i]! >= minPt && Math.abs(list.eta[i]!) <= maxAbsEta;
    keep[i] = pass ? 1 : 0;
    if (pass) n++;
  }
  return n;
}

/** Clears the keep-flag of kept objects of `list` lying within cone `which` of a kept object of `others`; returns how many of `list` stay. */
export function removeNear(list: ObjectList, keep: Uint8Array, others: ObjectList, othersKeep: Uint8Array, cones: Float64Array, which: number): number {
  let kept = 0;
  for (let i = 0; i < list.size; i++) {
    if (keep[i] !== 1) continue;
    if (nearKept(list, i, others, othersKeep, cones, which)) keep[i] = 0;
    else kept++;
  }
  return kept;
}
