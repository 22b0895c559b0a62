/**
 * Lepton-pair quantities shared by several event variables: the
 * same-flavour opposite-sign (SFOS) pair nearest the Z mass and pair masses.
 * All work on the selected light leptons of `AnalysisObjects`.
 */
import { M_Z } from '../physics/constants.js';
import type { AnalysisObjects } from './objects.js';

/** Invariant mass of leptons a and b (GeV), from their four-momenta. */
export function leptonPairMass(o: AnalysisObjects, a: number, b: number): number {
  const p = o.leptons.momentum;
  const i = 4 * a;
  const j = 4 * b;
  const px = p[i]! + p[j]!;
  const py = p[i + 1]! + p[j + 1]!;
  const pz = p[i + 2]! + p[j + 2]!;
  const e = p[i + 3]! + p[j + 3]!;
  const m2 = e * e - px * px - py * py - pz * pz;
  return m2 > 0 ? Math.sqrt(m2) : 0;
}

/** Whether leptons a and b have the same flavour and opposite charges. */
export function isSfos(o: AnalysisObjects, a: number, b: number): boolean {
  const l = o.leptons;
  return l.label[a] === l.label[b] && l.charge[a]! * l.charge[b]! < 0;
}

/**
 * Finds the SFOS pair whose mass lies nearest M_Z (PDG 2024, 91.188 GeV) and
 * caches it on `o` (`zFirst`, `zSecond`, `zMass`; -1, -1, 0 when the event
 * has no SFOS pair). Runs once per event whatever the number of callers.
 */
export function findZCandidate(o: AnalysisObjects): void {
  if (o.zSearched) return;
  o.zSearched = true;
  o.zFirst = -1;
  o.zSecond = -1;
  o.zMass = 0;
  let best = Infinity;
  const n = o.leptons.size;
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      if (!isSfos(o, a, b)) continue;
      const m = leptonPairMass(o, a, b);
      const distance = Math.abs(m - M_Z);
      if (distance < best) {
        best = distance;
        o.zFirst = a;
        o.zSecond = b;
        o.zMass = m;
      }
    }
  }
}

/** Smallest mass among lepton pairs, all pairs or SFOS pairs only; 0 when there is no such pair. */
export function minimumPairMass(o: AnalysisObjects, sfosOnly: boolean): number {
  let best = Infinity;
  const n = o.leptons.size;
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      if (sfosOnly && !isSfos(o, a, b)) continue;
      const m = leptonPairMass(o, a, b);
      if (m < best) best = m;
    }
  }
  return best === Infinity ? 0 : best;
}

/** Invariant mass of the three leading light leptons; 0 with fewer than three. */
export function threeLeptonMass(o: AnalysisObjects): number {
  if (o.leptons.size < 3) return 0;
  const p = o.leptons.momentum;
  const px = p[0]! + p[4]! + p[8]!;
  const py = p[1]! + p[5]! + p[9]!;
  const pz = p[2]! + p[6]! + p[10]!;
  const e = p[3]! + p[7]! + p[11]!;
  const m2 = e * e - px * px - py * py - pz * pz;
  return m2 > 0 ? Math.sqrt(m2) : 0;
}
