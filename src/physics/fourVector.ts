/**
 * Four-vectors stored in flat `Float64Array`s.
 *
 * Layout: vector `i` occupies `p[4i .. 4i+3]` = (px, py, pz, E), in GeV.
 * Metric (+, -, -, -). Azimuth phi in (-pi, pi]. These functions take the
 * array and the vector index, allocate nothing, and are what hot loops call;
 * `FourVector` at the end is a small facade for users and tests.
 */

/** Sets vector `i` from Cartesian components. */
export function setPxPyPzE(p: Float64Array, i: number, px: number, py: number, pz: number, e: number): void {
  const o = 4 * i;
  p[o] = px;
  p[o + 1] = py;
  p[o + 2] = pz;
  p[o + 3] = e;
}

/**
 * Sets vector `i` from transverse momentum, pseudorapidity, azimuth and mass.
 * px = pT cos(phi), py = pT sin(phi), pz = pT sinh(eta), E = sqrt(|p|^2 + m^2).
 */
export function setPtEtaPhiM(p: Float64Array, i: number, pt: number, eta: number, phi: number, m: number): void {
  const o = 4 * i;
  const pz = pt * Math.sinh(eta);
  p[o] = pt * Math.cos(phi);
  p[o + 1] = pt * Math.sin(phi);
  p[o + 2] = pz;
  p[o + 3] = Math.sqrt(pt * pt + pz * pz + m * m);
}

/** Copies vector `i` of `from` into vector `j` of `to`. */
export function copyVector(from: Float64Array, i: number, to: Float64Array, j: number): void {
  const a = 4 * i;
  const b = 4 * j;
  to[b] = from[a];
  to[b + 1] = from[a + 1];
  to[b + 2] = from[a + 2];
  to[b + 3] = from[a + 3];
}

/** Squared invariant mass E^2 - |p|^2 (GeV^2). */
export function mass2(p: Float64Array, i: number): number {
  const o = 4 * i;
  const px = p[o];
  const py = p[o + 1];
  const pz = p[o + 2];
  const e = p[o + 3];
  return e * e - px * px - py * py - pz * pz;
}

/** Invariant mass; negative (-sqrt(-m^2)) for a space-like vector, as is common practice. */
export function mass(p: Float64Array, i: number): number {
  const m2 = mass2(p, i);
  return m2 >= 0 ? Math.sqrt(m2) : -Math.sqrt(-m2);
}

/** Transverse momentum sqrt(px^2 + py^2). */
export function pt(p: Float64Array, i: number): number {
  const o = 4 * i;
  return Math.hypot(p[o], p[o + 1]);
}

/** Magnitude of the three-momentum. */
export function momentum(p: Float64Array, i: number): number {
  const o = 4 * i;
  return Math.hypot(p[o], p[o + 1], p[o + 2]);
}

/** Azimuth atan2(py, px) in (-pi, pi]. */
export function phi(p: Float64Array, i: number): number {
  const o = 4 * i;
  const a = Math.atan2(p[o + 1], p[o]);
  return a === -Math.PI ? Math.PI : a;
}

/**
 * Pseudorapidity eta = asinh(pz / pT) = -ln tan(theta/2).
 * A vector along the beam (pT = 0) gets +-Infinity (0 for the null vector).
 */
export function eta(p: Float64Array, i: number): number {
  const o = 4 * i;
  const ptValue = Math.hypot(p[o], p[o + 1]);
  const pz = p[o + 2];
  if (ptValue === 0) return pz === 0 ? 0 : pz > 0 ? Infinity : -Infinity;
  return Math.asinh(pz / ptValue);
}

/** Rapidity y = (1/2) ln((E + pz) / (E - pz)). */
export function rapidity(p: Float64Array, i: number): number {
  const o = 4 * i;
  const pz = p[o + 2];
  const e = p[o + 3];
  return 0.5 * Math.log((e + pz) / (e - pz));
}

/** Transverse energy of a massive vector, E_T = E pT / |p|. */
export function transverseEnergy(p: Float64Array, i: number): number {
  const ptValue = pt(p, i);
  const pAbs = momentum(p, i);
  return pAbs === 0 ? 0 : (p[4 * i + 3] * ptValue) / pAbs;
}

/** Difference of two azimuths folded into (-pi, pi]. */
export function deltaPhi(phi1: number, phi2: number): number {
  let d = phi1 - phi2;
  while (d > Math.PI) d -= 2 * Math.PI;
  while (d <= -Math.PI) d += 2 * Math.PI;
  return d;
}

/**
 * Angular distance Delta R = sqrt(Delta eta^2 + Delta phi^2).
 *
 * @example
 * deltaR(0, 0, 0.3, 0.4) // 0.5
 */
export function deltaR(eta1: number, phi1: number, eta2: number, phi2: number): number {
  const dEta = eta1 - eta2;
  const dPhi = deltaPhi(phi1, phi2);
  return Math.sqrt(dEta * dEta + dPhi * dPhi);
}

/** Delta R between vector `i` of `p` and vector `j` of `q`. */
export function deltaRBetween(p: Float64Array, i: number, q: Float64Array, j: number): number {
  return deltaR(eta(p, i), phi(p, i), eta(q, j), phi(q, j));
}

/** Invariant mass of the sum of vectors `i` and `j` of the same array. */
export function pairMass(p: Float64Array, i: number, j: number): number {
  const a = 4 * i;
  const b = 4 * j;
  const px = p[a] + p[b];
  const py = p[a + 1] + p[b + 1];
  const pz = p[a + 2] + p[b + 2];
  const e = p[a + 3] + p[b + 3];
  const m2 = e * e - px * px - py * py - pz * pz;
  return m2 > 0 ? Math.sqrt(m2) : 0;
}

/** Minkowski product p_i . q_j = E E' - p.p'. */
export function dot(p: Float64Array, i: number, q: Float64Array, j: number): number {
  const a = 4 * i;
  const b = 4 * j;
  return p[a + 3] * q[b + 3] - p[a] * q[b] - p[a + 1] * q[b + 1] - p[a + 2] * q[b + 2];
}

/** out_k = p_i + q_j. `out` may alias either input. */
export function addVectors(p: Float64Array, i: number, q: Float64Array, j: number, out: Float64Array, k: number): void {
  const a = 4 * i;
  const b = 4 * j;
  const c = 4 * k;
  const px = p[a] + q[b];
  const py = p[a + 1] + q[b + 1];
  const pz = p[a + 2] + q[b + 2];
  const e = p[a + 3] + q[b + 3];
  out[c] = px;
  out[c + 1] = py;
  out[c + 2] = pz;
  out[c + 3] = e;
}

/**
 * Transverse mass of two objects treated as massless,
 * mT = sqrt(2 pT1 pT2 (1 - cos(phi1 - phi2))) (common practice for lepton + missing momentum).
 *
 * @example
 * transverseMass(40, 0, 40, Math.PI) // 80
 */
export function transverseMass(pt1: number, phi1: number, pt2: number, phi2: number): number {
  const v = 2 * pt1 * pt2 * (1 - Math.cos(phi1 - phi2));
  return v > 0 ? Math.sqrt(v) : 0;
}

/**
 * Boosts vector `i` in place by velocity (bx, by, bz), |b| < 1: the vector seen
 * from a frame moving with velocity -b. Standard Lorentz transformation
 * (e.g. J. D. Jackson, Classical Electrodynamics, 3rd ed., eq. 11.19).
 */
export function boost(p: Float64Array, i: number, bx: number, by: number, bz: number): void {
  const b2 = bx * bx + by * by + bz * bz;
  if (b2 === 0) return;
  if (!(b2 < 1)) throw new RangeError(`boost velocity must be below 1, got |b| = ${Math.sqrt(b2)}`);
  const o = 4 * i;
  const px = p[o];
  const py = p[o + 1];
  const pz = p[o + 2];
  const e = p[o + 3];
  const gamma = 1 / Math.sqrt(1 - b2);
  const bp = bx * px + by * py + bz * pz;
  const g2 = (gamma - 1) / b2;
  const f = g2 * bp + gamma * e;
  p[o] = px + f * bx;
  p[o + 1] = py + f * by;
  p[o + 2] = pz + f * bz;
  p[o + 3] = gamma * (e + bp);
}

/**
 * Boosts vector `i` of `p` into the rest frame of vector `j` of `frame`
 * (the inverse of boosting by that vector's velocity).
 */
export function boostToRestFrame(p: Float64Array, i: number, frame: Float64Array, j: number): void {
  const o = 4 * j;
  const e = frame[o + 3];
  boost(p, i, -frame[o] / e, -frame[o + 1] / e, -frame[o + 2] / e);
}

/** Boosts vector `i` of `p` from the rest frame of vector `j` of `frame` to the frame `frame` is given in. */
export function boostFromRestFrame(p: Float64Array, i: number, frame: Float64Array, j: number): void {
  const o = 4 * j;
  const e = frame[o + 3];
  boost(p, i, frame[o] / e, frame[o + 1] / e, frame[o + 2] / e);
}

/** Rotates vector `i` in place about the z axis by angle `a`. */
export function rotateZ(p: Float64Array, i: number, a: number): void {
  const o = 4 * i;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const px = p[o];
  const py = p[o + 1];
  p[o] = c * px - s * py;
  p[o + 1] = s * px + c * py;
}

/** Rotates vector `i` in place about the y axis by angle `a`. */
export function rotateY(p: Float64Array, i: number, a: number): void {
  const o = 4 * i;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const px = p[o];
  const pz = p[o + 2];
  p[o] = c * px + s * pz;
  p[o + 2] = -s * px + c * pz;
}

/**
 * A single four-vector: the friendly facade over the flat-array functions,
 * for users, scripts and tests. Hot loops use the functions directly.
 */
export class FourVector {
  readonly data: Float64Array;

  private constructor(data: Float64Array) {
    this.data = data;
  }

  /** @example FourVector.fromPxPyPzE(3, 4, 0, 13).mass // 12 */
  static fromPxPyPzE(px: number, py: number, pz: number, e: number): FourVector {
    return new FourVector(Float64Array.of(px, py, pz, e));
  }

  static fromPtEtaPhiM(ptValue: number, etaValue: number, phiValue: number, m: number): FourVector {
    const data = new Float64Array(4);
    setPtEtaPhiM(data, 0, ptValue, etaValue, phiValue, m);
    return new FourVector(data);
  }

  get px(): number {
    return this.data[0];
  }
  get py(): number {
    return this.data[1];
  }
  get pz(): number {
    return this.data[2];
  }
  get e(): number {
    return this.data[3];
  }
  get mass(): number {
    return mass(this.data, 0);
  }
  get pt(): number {
    return pt(this.data, 0);
  }
  get eta(): number {
    return eta(this.data, 0);
  }
  get phi(): number {
    return phi(this.data, 0);
  }
  get rapidity(): number {
    return rapidity(this.data, 0);
  }

  plus(other: FourVector): FourVector {
    const out = new Float64Array(4);
    addVectors(this.data, 0, other.data, 0, out, 0);
    return new FourVector(out);
  }

  /** A boosted copy (velocity b, |b| < 1). */
  boosted(bx: number, by: number, bz: number): FourVector {
    const out = Float64Array.from(this.data);
    boost(out, 0, bx, by, bz);
    return new FourVector(out);
  }

  deltaR(other: FourVector): number {
    return deltaRBetween(this.data, 0, other.data, 0);
  }
}
