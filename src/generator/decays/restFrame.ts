/**
 * Decay kinematics in the parent's rest frame (two- and three-body) and the
 * boost out of it.
 *
 * The boost is written with the parent's four-momentum and mass instead of
 * its velocity.
 *
 * For a parent (E, P) of mass M and a vector (e*, p*) in its rest frame:
 *   e = (E e* + P.p*) / M,   p = p* + P ((P.p*) / (M (E + M)) + e* / M)
 * (the Lorentz boost of J. D. Jackson, Classical Electrodynamics, 3rd ed.,
 * eq. 11.19, with gamma = E/M and gamma beta = P/M). Unlike a boost by beta = P/E it never forms 1 - beta^2, so a
 * tau of gamma ~ 3000 keeps its daughters' momenta summing to its own within
 * machine precision: the rest-frame daughters summing to (M, 0) are boosted to
 * exactly (E, P).
 */
import { dalitzKinematics } from '../../physics/phaseSpace.js';
import type { RandomStream } from '../../physics/random.js';

/**
 * Boosts vector `k` of `rest` (rest-frame components) into slot `o` of `out`,
 * for the parent vector `j` of `frame` with mass `frameMass` (> 0, GeV).
 * `out` may be `frame` but slot `o` must differ from `j`.
 */
export function boostFromRest(rest: Float64Array, k: number, frame: Float64Array, j: number, frameMass: number, out: Float64Array, o: number): void {
  const a = 4 * k;
  const f = 4 * j;
  const px = frame[f]!;
  const py = frame[f + 1]!;
  const pz = frame[f + 2]!;
  const e = frame[f + 3]!;
  const qx = rest[a]!;
  const qy = rest[a + 1]!;
  const qz = rest[a + 2]!;
  const q0 = rest[a + 3]!;
  const pq = px * qx + py * qy + pz * qz;
  const c = pq / (frameMass * (e + frameMass)) + q0 / frameMass;
  const b = 4 * o;
  out[b] = qx + px * c;
  out[b + 1] = qy + py * c;
  out[b + 2] = qz + pz * c;
  out[b + 3] = (e * q0 + pq) / frameMass;
}

/** Invariant mass of vector `i` (0 for a space-like or null vector), GeV. */
export function restMass(p: Float64Array, i: number): number {
  const o = 4 * i;
  const e = p[o + 3]!;
  const m2 = e * e - p[o]! * p[o]! - p[o + 1]! * p[o + 1]! - p[o + 2]! * p[o + 2]!;
  return m2 > 0 ? Math.sqrt(m2) : 0;
}

/**
 * Two-body decay of a parent at rest with mass `parentMass` into masses m1, m2:
 * daughter 1 along the direction (cosTheta, phiAngle) about the lab axes,
 * daughter 2 opposite; p* = sqrt(lambda(M^2, m1^2, m2^2)) / 2M (PDG Review,
 * "Kinematics"). Writes slots i1, i2 of `out`; the caller checks the threshold.
 */
export function twoBodyAtRest(out: Float64Array, i1: number, i2: number, parentMass: number, m1: number, m2: number, cosTheta: number, phiAngle: number): void {
  const M2 = parentMass * parentMass;
  const a = m1 * m1;
  const b = m2 * m2;
  const lambda = M2 * M2 + a * a + b * b - 2 * (M2 * a + M2 * b + a * b);
  const p = lambda > 0 ? Math.sqrt(lambda) / (2 * parentMass) : 0;
  const sinTheta = Math.sqrt(Math.max(0, 1 - cosTheta * cosTheta));
  const x = p * sinTheta * Math.cos(phiAngle);
  const y = p * sinTheta * Math.sin(phiAngle);
  const z = p * cosTheta;
  const o1 = 4 * i1;
  const o2 = 4 * i2;
  out[o1] = x;
  out[o1 + 1] = y;
  out[o1 + 2] = z;
  out[o1 + 3] = (M2 + a - b) / (2 * parentMass);
  out[o2] = -x;
  out[o2 + 1] = -y;
  out[o2 + 2] = -z;
  out[o2 + 3] = (M2 - a + b) / (2 * parentMass);
}

const kinematics = new Float64Array(5);

/**
 * Three-body decay of a parent at rest with mass `parentMass` from the
 * Dalitz variables (m12^2, m23^2), with a uniformly random orientation:
 * particle 3 along a random direction, particle 1 at its fixed angle to 3
 * and a uniform azimuth about it (the three daughters' plane is then
 * isotropic: PDG Review, "Kinematics", three-body decays). Writes slots i1,
 * i2, i3 of `out`; returns false (writing nothing, drawing nothing) if the
 * point lies outside the Dalitz region.
 */
export function threeBodyAtRest(
  out: Float64Array,
  i1: number,
  i2: number,
  i3: number,
  parentMass: number,
  m1: number,
  m2: number,
  m3: number,
  m12sq: number,
  m23sq: number,
  rng: RandomStream,
): boolean {
  if (!dalitzKinematics(parentMass, m1, m2, m3, m12sq, m23sq, kinematics)) return false;
  const e1 = kinematics[0]!;
  const p1 = kinematics[1]!;
  const e3 = kinematics[2]!;
  const p3 = kinematics[3]!;
  const cos13 = kinematics[4]!;
  const sin13 = Math.sqrt(1 - cos13 * cos13);
  // Direction n of particle 3, uniform on the sphere; (a, b) completes an orthonormal basis.
  const cz = 2 * rng.uniform() - 1;
  const sz = Math.sqrt(Math.max(0, 1 - cz * cz));
  const az = 2 * Math.PI * rng.uniform();
  const ca = Math.cos(az);
  const sa = Math.sin(az);
  const nx = sz * ca;
  const ny = sz * sa;
  const nz = cz;
  // a = d n / d theta, b = n x a: the standard spherical basis (e_theta, e_phi).
  const ax = cz * ca;
  const ay = cz * sa;
  const az2 = -sz;
  const bx = -sa;
  const by = ca;
  // Particle 1 at angle acos(cos13) from n, uniform azimuth psi about n.
  const psi = 2 * Math.PI * rng.uniform();
  const u = sin13 * Math.cos(psi);
  const v = sin13 * Math.sin(psi);
  const d1x = p1 * (u * ax + v * bx + cos13 * nx);
  const d1y = p1 * (u * ay + v * by + cos13 * ny);
  const d1z = p1 * (u * az2 + cos13 * nz);
  const o1 = 4 * i1;
  const o2 = 4 * i2;
  const o3 = 4 * i3;
  out[o3] = p3 * nx;
  out[o3 + 1] = p3 * ny;
  out[o3 + 2] = p3 * nz;
  out[o3 + 3] = e3;
  out[o1] = d1x;
  out[o1 + 1] = d1y;
  out[o1 + 2] = d1z;
  out[o1 + 3] = e1;
  out[o2] = -d1x - p3 * nx;
  out[o2 + 1] = -d1y - p3 * ny;
  out[o2 + 2] = -d1z - p3 * nz;
  out[o2 + 3] = parentMass - e1 - e3;
  return true;
}

/**
 * Three-body decay at rest distributed uniformly in phase space: flat in the
 * Dalitz plot (dPhi_3 ∝ dm12^2 dm23^2, PDG Review, "Kinematics"), drawn in
 * the bounding rectangle and kept inside the Dalitz region. The caller checks
 * the threshold (parentMass > m1 + m2 + m3).
 */
export function threeBodyFlatAtRest(out: Float64Array, i1: number, i2: number, i3: number, parentMass: number, m1: number, m2: number, m3: number, rng: RandomStream): void {
  const lo12 = (m1 + m2) ** 2;
  const hi12 = (parentMass - m3) ** 2;
  const lo23 = (m2 + m3) ** 2;
  const hi23 = (parentMass - m1) ** 2;
  for (;;) {
    const m12sq = lo12 + (hi12 - lo12) * rng.uniform();
    const m23sq = lo23 + (hi23 - lo23) * rng.uniform();
    if (threeBodyAtRest(out, i1, i2, i3, parentMass, m1, m2, m3, m12sq, m23sq, rng)) return;
  }
}
