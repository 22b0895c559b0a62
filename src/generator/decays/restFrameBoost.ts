/**
 * Boost from a parent's rest frame written with the parent's four-momentum and
 * mass instead of its velocity.
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
