/**
 * Two- and three-body decay kinematics on flat four-vector arrays.
 *
 * Conventions: masses in GeV; daughters are written into `out` at the given
 * vector indices; angles are drawn from the `RandomStream` passed in. No
 * function here allocates.
 */
import { TamisError } from '../errors.js';
import { boost } from './fourVector.js';
import type { RandomStream } from './random.js';

/**
 * Källén triangle function lambda(a, b, c) = a^2 + b^2 + c^2 - 2ab - 2ac - 2bc
 * (PDG Review of Particle Physics, "Kinematics" section: p* = sqrt(lambda(M^2, m1^2, m2^2)) / 2M).
 *
 * @example
 * kallen(100, 0, 0) // 10000
 */
export function kallen(a: number, b: number, c: number): number {
  return a * a + b * b + c * c - 2 * (a * b + a * c + b * c);
}

/**
 * Momentum of either daughter in the rest frame of a parent of mass M decaying
 * to masses m1 and m2: p* = sqrt(lambda(M^2, m1^2, m2^2)) / (2M).
 * Throws a `physics` error below threshold.
 *
 * @example
 * twoBodyMomentum(91.188, 0, 0) // 45.594
 */
export function twoBodyMomentum(parentMass: number, m1: number, m2: number): number {
  if (parentMass < m1 + m2) {
    throw new TamisError('physics', `decay below threshold: ${parentMass} GeV -> ${m1} + ${m2} GeV`);
  }
  const l = kallen(parentMass * parentMass, m1 * m1, m2 * m2);
  return l > 0 ? Math.sqrt(l) / (2 * parentMass) : 0;
}

/**
 * Two-body decay of vector `ip` of `parent` into masses m1, m2.
 *
 * In the parent rest frame daughter 1 flies along the direction with polar angle
 * acos(cosTheta) and azimuth phiAngle measured about `axis`; `axis` = null means
 * the lab z axis, otherwise (ax, ay, az) (any length) gives the quantisation axis,
 * e.g. the parent's flight direction for helicity angles. Both daughters are then
 * boosted to the parent's frame.
 */
export function twoBodyDecay(
  parent: Float64Array,
  ip: number,
  m1: number,
  m2: number,
  cosTheta: number,
  phiAngle: number,
  out: Float64Array,
  i1: number,
  i2: number,
  axis: readonly [number, number, number] | null = null,
): void {
  const o = 4 * ip;
  const px = parent[o];
  const py = parent[o + 1];
  const pz = parent[o + 2];
  const e = parent[o + 3];
  const m2parent = e * e - px * px - py * py - pz * pz;
  const parentMass = Math.sqrt(m2parent > 0 ? m2parent : 0);
  const pStar = twoBodyMomentum(parentMass, m1, m2);
  const sinTheta = Math.sqrt(Math.max(0, 1 - cosTheta * cosTheta));
  let dx = sinTheta * Math.cos(phiAngle);
  let dy = sinTheta * Math.sin(phiAngle);
  let dz = cosTheta;
  if (axis !== null) {
    // Rotate (dx, dy, dz) from a frame whose z axis is `axis` to the lab frame.
    const n = Math.hypot(axis[0], axis[1], axis[2]);
    if (n > 0) {
      const ax = axis[0] / n;
      const ay = axis[1] / n;
      const az = axis[2] / n;
      const t = Math.hypot(ax, ay);
      if (t > 1e-12) {
        // e1 = (ax az, ay az, -t)/t, e2 = (-ay, ax, 0)/t, e3 = axis
        const e1x = (ax * az) / t;
        const e1y = (ay * az) / t;
        const e1z = -t;
        const e2x = -ay / t;
        const e2y = ax / t;
        const rx = dx * e1x + dy * e2x + dz * ax;
        const ry = dx * e1y + dy * e2y + dz * ay;
        const rz = dx * e1z + dz * az;
        dx = rx;
        dy = ry;
        dz = rz;
      } else if (az < 0) {
        dy = -dy;
        dz = -dz;
      }
    }
  }
  const a = 4 * i1;
  const b = 4 * i2;
  out[a] = pStar * dx;
  out[a + 1] = pStar * dy;
  out[a + 2] = pStar * dz;
  out[a + 3] = Math.sqrt(pStar * pStar + m1 * m1);
  out[b] = -pStar * dx;
  out[b + 1] = -pStar * dy;
  out[b + 2] = -pStar * dz;
  out[b + 3] = Math.sqrt(pStar * pStar + m2 * m2);
  if (e > 0) {
    const bx = px / e;
    const by = py / e;
    const bz = pz / e;
    boost(out, i1, bx, by, bz);
    boost(out, i2, bx, by, bz);
  }
}

/** Isotropic two-body decay (uniform cos theta and phi in the parent rest frame). */
export function isotropicTwoBodyDecay(
  parent: Float64Array,
  ip: number,
  m1: number,
  m2: number,
  rng: RandomStream,
  out: Float64Array,
  i1: number,
  i2: number,
): void {
  const cosTheta = 2 * rng.uniform() - 1;
  const phiAngle = 2 * Math.PI * rng.uniform() - Math.PI;
  twoBodyDecay(parent, ip, m1, m2, cosTheta, phiAngle, out, i1, i2);
}

/** Limits of the Dalitz variable m23^2 at fixed m12^2 (PDG Review, "Kinematics", three-body decays). */
export function dalitzLimits(
  parentMass: number,
  m1: number,
  m2: number,
  m3: number,
  m12sq: number,
  out: Float64Array,
): void {
  const m12 = Math.sqrt(m12sq);
  // Energies of 2 and 3 in the (12) rest frame.
  const e2 = (m12sq - m1 * m1 + m2 * m2) / (2 * m12);
  const e3 = (parentMass * parentMass - m12sq - m3 * m3) / (2 * m12);
  const p2 = Math.sqrt(Math.max(0, e2 * e2 - m2 * m2));
  const p3 = Math.sqrt(Math.max(0, e3 * e3 - m3 * m3));
  const s = e2 + e3;
  out[0] = s * s - (p2 + p3) * (p2 + p3);
  out[1] = s * s - (p2 - p3) * (p2 - p3);
}

const limitsScratch = new Float64Array(2);

/**
 * The rest-frame kinematics of a three-body decay at the Dalitz point
 * (m12^2, m23^2): writes E1, |p1|, E3, |p3| and cos(theta_13) to out[0..4]
 * (E1 = (M^2 + m1^2 - m23^2) / 2M, E3 = (M^2 + m3^2 - m12^2) / 2M and
 * m13^2 = m1^2 + m3^2 + 2 (E1 E3 - p1 p3 cos13); PDG Review, "Kinematics",
 * three-body decays). Returns false, writing nothing, outside the Dalitz region.
 */
export function dalitzKinematics(parentMass: number, m1: number, m2: number, m3: number, m12sq: number, m23sq: number, out: Float64Array): boolean {
  if (m12sq < (m1 + m2) ** 2 || m12sq > (parentMass - m3) ** 2) return false;
  dalitzLimits(parentMass, m1, m2, m3, m12sq, limitsScratch);
  if (m23sq < limitsScratch[0] || m23sq > limitsScratch[1]) return false;
  const bigM2 = parentMass * parentMass;
  const m13sq = bigM2 + m1 * m1 + m2 * m2 + m3 * m3 - m12sq - m23sq;
  const e1 = (bigM2 + m1 * m1 - m23sq) / (2 * parentMass);
  const e3 = (bigM2 + m3 * m3 - m12sq) / (2 * parentMass);
  const p1 = Math.sqrt(Math.max(0, e1 * e1 - m1 * m1));
  const p3 = Math.sqrt(Math.max(0, e3 * e3 - m3 * m3));
  const cos13 = p1 > 0 && p3 > 0 ? (2 * e1 * e3 + m1 * m1 + m3 * m3 - m13sq) / (2 * p1 * p3) : 1;
  out[0] = e1;
  out[1] = p1;
  out[2] = e3;
  out[3] = p3;
  out[4] = cos13 < -1 ? -1 : cos13 > 1 ? 1 : cos13;
  return true;
}

const kinematicsScratch = new Float64Array(5);

/**
 * Builds a three-body decay of vector `ip` of `parent` from the Dalitz
 * variables (m12^2, m23^2), oriented uniformly at random, and boosts it to the
 * parent's frame. Returns false (writing nothing) if the point lies outside
 * the Dalitz region.
 */
export function threeBodyFromDalitz(
  parent: Float64Array,
  ip: number,
  m1: number,
  m2: number,
  m3: number,
  m12sq: number,
  m23sq: number,
  rng: RandomStream,
  out: Float64Array,
  i1: number,
  i2: number,
  i3: number,
): boolean {
  const o = 4 * ip;
  const px = parent[o];
  const py = parent[o + 1];
  const pz = parent[o + 2];
  const e = parent[o + 3];
  const bigM2 = e * e - px * px - py * py - pz * pz;
  const bigM = Math.sqrt(bigM2 > 0 ? bigM2 : 0);
  const k = kinematicsScratch;
  if (!dalitzKinematics(bigM, m1, m2, m3, m12sq, m23sq, k)) return false;
  const e1 = k[0];
  const p1 = k[1];
  const e3 = k[2];
  const p3 = k[3];
  const cos13 = k[4];
  const sin13 = Math.sqrt(1 - cos13 * cos13);
  // Particle 3 along z, particle 1 in the x-z plane, particle 2 balances.
  const a = 4 * i1;
  const b = 4 * i2;
  const c = 4 * i3;
  out[c] = 0;
  out[c + 1] = 0;
  out[c + 2] = p3;
  out[c + 3] = e3;
  out[a] = p1 * sin13;
  out[a + 1] = 0;
  out[a + 2] = p1 * cos13;
  out[a + 3] = e1;
  out[b] = -out[a];
  out[b + 1] = 0;
  out[b + 2] = -out[a + 2] - p3;
  out[b + 3] = bigM - e1 - e3;
  // Uniform orientation: Euler angles (alpha, beta, gamma) with cos(beta) uniform.
  const alpha = 2 * Math.PI * rng.uniform();
  const cosBeta = 2 * rng.uniform() - 1;
  const gamma = 2 * Math.PI * rng.uniform();
  rotateEuler(out, i1, alpha, cosBeta, gamma);
  rotateEuler(out, i2, alpha, cosBeta, gamma);
  rotateEuler(out, i3, alpha, cosBeta, gamma);
  if (e > 0) {
    const bx = px / e;
    const by = py / e;
    const bz = pz / e;
    boost(out, i1, bx, by, bz);
    boost(out, i2, bx, by, bz);
    boost(out, i3, bx, by, bz);
  }
  return true;
}

/** R = Rz(alpha) Ry(beta) Rz(gamma) applied to vector i in place. */
function rotateEuler(p: Float64Array, i: number, alpha: number, cosBeta: number, gamma: number): void {
  const o = 4 * i;
  const sinBeta = Math.sqrt(Math.max(0, 1 - cosBeta * cosBeta));
  let x = p[o];
  let y = p[o + 1];
  let z = p[o + 2];
  // Rz(gamma)
  let c = Math.cos(gamma);
  let s = Math.sin(gamma);
  let t = c * x - s * y;
  y = s * x + c * y;
  x = t;
  // Ry(beta)
  t = cosBeta * x + sinBeta * z;
  z = -sinBeta * x + cosBeta * z;
  x = t;
  // Rz(alpha)
  c = Math.cos(alpha);
  s = Math.sin(alpha);
  t = c * x - s * y;
  y = s * x + c * y;
  x = t;
  p[o] = x;
  p[o + 1] = y;
  p[o + 2] = z;
}

/**
 * Three-body decay distributed uniformly in phase space (flat in the Dalitz
 * plot, since dPhi_3 is proportional to dm12^2 dm23^2: PDG Review, "Kinematics").
 * Draws (m12^2, m23^2) uniformly in the bounding rectangle and rejects points
 * outside the Dalitz region. Throws below threshold.
 */
export function threeBodyDecayFlat(
  parent: Float64Array,
  ip: number,
  m1: number,
  m2: number,
  m3: number,
  rng: RandomStream,
  out: Float64Array,
  i1: number,
  i2: number,
  i3: number,
): void {
  const o = 4 * ip;
  const e = parent[o + 3];
  const bigM2 = e * e - parent[o] * parent[o] - parent[o + 1] * parent[o + 1] - parent[o + 2] * parent[o + 2];
  const bigM = Math.sqrt(bigM2 > 0 ? bigM2 : 0);
  if (bigM < m1 + m2 + m3) {
    throw new TamisError('physics', `decay below threshold: ${bigM} GeV -> ${m1} + ${m2} + ${m3} GeV`);
  }
  const lo12 = (m1 + m2) ** 2;
  const hi12 = (bigM - m3) ** 2;
  const lo23 = (m2 + m3) ** 2;
  const hi23 = (bigM - m1) ** 2;
  for (;;) {
    const m12sq = lo12 + (hi12 - lo12) * rng.uniform();
    const m23sq = lo23 + (hi23 - lo23) * rng.uniform();
    if (threeBodyFromDalitz(parent, ip, m1, m2, m3, m12sq, m23sq, rng, out, i1, i2, i3)) return;
  }
}
