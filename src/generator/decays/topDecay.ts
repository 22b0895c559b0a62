/**
 * Top-quark decay t -> q W+ -> q f1 f2 with the V-A matrix element and the
 * full angular correlation of the W decay.
 *
 * For t(P) -> q(k) W+ -> q fbar(p1) f(p2) (fbar = l+ or dbar-type, f = nu or
 * u-type) the spin-summed |M|^2 with an on-shell W is proportional to
 * (P . p1)(k . p2): the muon-decay structure with t in place of mu- and the
 * antifermion in place of nubar_e (Griffiths, Introduction to Elementary
 * Particles, sec. 10.2; common practice for top decays). The top is treated as
 * unpolarised (no spin correlation with production: a tamis simplification),
 * so the W direction is isotropic in the top rest frame.
 *
 * In the W rest frame, with the W flight direction in the top frame as axis,
 * t and q both move along -axis with momentum Q; with cos(theta*) of fbar
 * about the axis, E_t, E_q the energies, and K, E1, E2 the momentum and
 * energies of fbar and f:
 *   (P . p1)(k . p2) = (E_t E1 + Q K c)(E_q E2 - Q K c),  c = cos(theta*),
 * a quadratic in c that we sample by acceptance-rejection against its maximum.
 * With m_q = 0 it equals 3/4 F0 (1 - c^2) + 3/8 FL (1 - c)^2 with
 * F0 = m_t^2 / (m_t^2 + 2 M_W^2), FL = 1 - F0, FR = 0 (helicityFractionsLO).
 * The same formula holds for t-bar -> qbar W- with the charge-conjugate
 * particles in the same places.
 */
import { setPxPyPzE } from '../../physics/fourVector.js';
import { twoBodyMomentum } from '../../physics/phaseSpace.js';
import type { RandomStream } from '../../physics/random.js';
import { boostFromRest, twoBodyAtRest } from './restFrame.js';

/** W helicity fractions at leading order (longitudinal, left-handed, right-handed). */
export interface HelicityFractions {
  f0: number;
  fl: number;
  fr: number;
}

/**
 * Leading-order W helicity fractions in t -> q W+ with quark mass m_q, read off
 * the quadratic (E_t E1 + Q K c)(E_q E2 - Q K c) written as
 * a (1 - c^2) + b (1 - c)^2 + d (1 + c)^2 with massless W daughters
 * (E1 = E2 = K = M_W / 2); the fractions are 4a/3, 8b/3, 8d/3 normalised.
 * For m_q = 0: F0 = m_t^2 / (m_t^2 + 2 M_W^2) (../shared/checks.md, section 4).
 *
 * @example
 * helicityFractionsLO(172.57, 80.3692, 0).f0 // 0.69746...
 */
export function helicityFractionsLO(topMass: number, wMass: number, quarkMass: number): HelicityFractions {
  const eq = (topMass * topMass - quarkMass * quarkMass - wMass * wMass) / (2 * wMass);
  const q = Math.sqrt(Math.max(0, eq * eq - quarkMass * quarkMass));
  const et = eq + wMass;
  // (E_t + Q c)(E_q - Q c) = E_t E_q - Q M_W c - Q^2 c^2 (the common factor K^2 dropped).
  const a = (et * eq + q * q) / 2;
  const b = (et * eq - q * q + q * wMass) / 4;
  const d = (et * eq - q * q - q * wMass) / 4;
  const n0 = (4 / 3) * a;
  const nl = (8 / 3) * b;
  const nr = (8 / 3) * d;
  const sum = n0 + nl + nr;
  return { f0: n0 / sum, fl: nl / sum, fr: nr / sum };
}

/** Scratch vectors in the top rest frame: 1 quark, 2 W, 3 fbar, 4 f; 5 and 6 fbar, f in the W rest frame. */
export class TopDecayScratch {
  readonly p = new Float64Array(28);
}

/**
 * Decays the top (vector `iTop` of `momentum`, invariant mass `topMass`) to a quark of mass `quarkMass`
 * and a W of mass `wMass`, and the W to (fbar, f) of masses m1, m2, with the
 * V-A angular correlation. Writes the lab four-momenta of quark, W, fbar, f
 * at iQuark, iW, i1, i2 of `momentum` (which must already hold those slots).
 * Throws a `physics` TamisError below threshold.
 */
export function decayTopVA(
  momentum: Float64Array,
  iTop: number,
  topMass: number,
  quarkMass: number,
  wMass: number,
  m1: number,
  m2: number,
  rng: RandomStream,
  scratch: TopDecayScratch,
  iQuark: number,
  iW: number,
  i1: number,
  i2: number,
): void {
  const mt = topMass;
  const p = scratch.p;
  // Unpolarised top: the W flies isotropically in the top rest frame.
  twoBodyAtRest(p, 1, 2, mt, quarkMass, wMass, 2 * rng.uniform() - 1, 2 * Math.PI * rng.uniform());

  // Kinematics in the W rest frame (see the file comment).
  const eq = (mt * mt - quarkMass * quarkMass - wMass * wMass) / (2 * wMass);
  const bigQ = Math.sqrt(Math.max(0, eq * eq - quarkMass * quarkMass));
  const et = eq + wMass;
  const k = twoBodyMomentum(wMass, m1, m2);
  const e1 = Math.sqrt(k * k + m1 * m1);
  const e2 = Math.sqrt(k * k + m2 * m2);
  const alpha = et * e1;
  const beta = eq * e2;
  const qk = bigQ * k;
  // Maximum of (alpha + qk c)(beta - qk c) on [-1, 1]: at the vertex, clamped.
  let cStar = qk > 0 ? (beta - alpha) / (2 * qk) : 0;
  cStar = cStar < -1 ? -1 : cStar > 1 ? 1 : cStar;
  const wMax = (alpha + qk * cStar) * (beta - qk * cStar);
  let c: number;
  for (;;) {
    c = 2 * rng.uniform() - 1;
    if (rng.uniform() * wMax <= (alpha + qk * c) * (beta - qk * c)) break;
  }
  // Helicity frame: n along the W flight direction in the top frame, e1 and e2 any
  // orthonormal completion (the azimuth about n is uniform, so the choice does not matter).
  const px = p[8]!;
  const py = p[9]!;
  const pz = p[10]!;
  const norm = Math.sqrt(px * px + py * py + pz * pz);
  const nx = px / norm;
  const ny = py / norm;
  const nz = pz / norm;
  // e1 = n x (x axis or z axis, whichever is less parallel to n), normalised; e2 = n x e1.
  let ax: number;
  let ay: number;
  let az: number;
  if (Math.abs(nx) < 0.6) {
    ax = 0;
    ay = nz;
    az = -ny;
  } else {
    ax = ny;
    ay = -nx;
    az = 0;
  }
  const an = Math.sqrt(ax * ax + ay * ay + az * az);
  ax /= an;
  ay /= an;
  az /= an;
  const bx = ny * az - nz * ay;
  const by = nz * ax - nx * az;
  const bz = nx * ay - ny * ax;
  const s = Math.sqrt(Math.max(0, 1 - c * c));
  const phi = 2 * Math.PI * rng.uniform();
  const u = s * Math.cos(phi);
  const v = s * Math.sin(phi);
  // W daughters in the W rest frame (slots 5 and 6), then boosted to the top frame (slots 3 and 4).
  const dx = k * (u * ax + v * bx + c * nx);
  const dy = k * (u * ay + v * by + c * ny);
  const dz = k * (u * az + v * bz + c * nz);
  setPxPyPzE(p, 5, dx, dy, dz, e1);
  setPxPyPzE(p, 6, -dx, -dy, -dz, e2);
  boostFromRest(p, 5, p, 2, wMass, p, 3);
  boostFromRest(p, 6, p, 2, wMass, p, 4);

  boostFromRest(p, 1, momentum, iTop, mt, momentum, iQuark);
  boostFromRest(p, 2, momentum, iTop, mt, momentum, iW);
  boostFromRest(p, 3, momentum, iTop, mt, momentum, i1);
  boostFromRest(p, 4, momentum, iTop, mt, momentum, i2);
}
