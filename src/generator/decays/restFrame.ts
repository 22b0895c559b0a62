/**
 * Decay kinematics in the parent's rest frame and the boost out of it.
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
