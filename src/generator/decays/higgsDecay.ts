/**
 * Masses of the (possibly off-shell) vector bosons in h -> W W* and h -> Z Z*,
 * and of the Z in h -> Z gamma.
 *
 * h -> V1 V2 with both V allowed off shell (A. Djouadi, "The anatomy of
 * electroweak symmetry breaking I", Phys. Rept. 457 (2008) 1,
 * hep-ph/0503172, section 2.2; from memory):
 *   dGamma ∝ BW(s1) BW(s2) sqrt(lambda) (lambda + 12 x1 x2) ds1 ds2,
 *   x_i = s_i / m_h^2, lambda = (1 - x1 - x2)^2 - 4 x1 x2,
 * with BW the Breit-Wigner of the V. The kinematic factor
 * vectorPairWeight = sqrt(lambda)(lambda + 12 x1 x2) is 1 at x1 = x2 = 0 and
 * below 1 elsewhere in the physical region (a test scans it).
 *
 * Sampling (exact, tamis's own construction): every physical point
 * (m1 + m2 <= m_h) has min(m1, m2) <= m_h / 2. Draw a from the Breit-Wigner on
 * the full range and b from the Breit-Wigner restricted to m <= m_h / 2, give
 * them to (V1, V2) in random order, reject unphysical points, and accept with
 * probability vectorPairWeight / n, where n (1 or 2) counts how many of the two
 * masses lie below m_h / 2. The proposal density is then proportional to
 * BW(s1) BW(s2) n, so accepted points follow BW BW x weight exactly.
 */
import type { RandomStream } from '../../physics/random.js';
import { sampleBreitWignerS } from './breitWigner.js';

/**
 * sqrt(lambda) (lambda + 12 x1 x2) with lambda = (1 - x1 - x2)^2 - 4 x1 x2:
 * the phase-space and matrix-element factor of h -> V V* (Djouadi 2008; from
 * memory). Zero outside the physical region.
 *
 * @example
 * vectorPairWeight(0, 0) // 1
 */
export function vectorPairWeight(x1: number, x2: number): number {
  const a = 1 - x1 - x2;
  const lambda = a * a - 4 * x1 * x2;
  if (lambda <= 0 || a <= 0) return 0;
  return Math.sqrt(lambda) * (lambda + 12 * x1 * x2);
}

/**
 * Draws the two vector-boson masses (GeV) of h -> V V(*) for a Higgs of mass
 * `higgsMass`, a vector of pole mass `vMass` and width `vWidth`, each mass at
 * least `massMin` (the lightest open decay channel of the V). Writes them to
 * out[0] and out[1].
 */
export function sampleVectorPairMasses(higgsMass: number, vMass: number, vWidth: number, massMin: number, rng: RandomStream, out: Float64Array): void {
  const mh2 = higgsMass * higgsMass;
  const sLow = massMin * massMin;
  const sFull = (higgsMass - massMin) ** 2;
  const half = higgsMass / 2;
  const sHalf = half * half;
  for (;;) {
    const sa = sampleBreitWignerS(vMass, vWidth, sLow, sFull, rng);
    const sb = sampleBreitWignerS(vMass, vWidth, sLow, sHalf, rng);
    const ma = Math.sqrt(sa);
    const mb = Math.sqrt(sb);
    if (ma + mb >= higgsMass) continue;
    const n = ma <= half ? 2 : 1;
    if (rng.uniform() * n > vectorPairWeight(sa / mh2, sb / mh2)) continue;
    if (rng.uniform() < 0.5) {
      out[0] = ma;
      out[1] = mb;
    } else {
      out[0] = mb;
      out[1] = ma;
    }
    return;
  }
}

/**
 * Draws the Z mass (GeV) in h -> Z gamma: the Z Breit-Wigner times the
 * two-body factor (1 - s / m_h^2)^3 of this loop-induced decay (its width is
 * proportional to (1 - M_Z^2/m_h^2)^3: Djouadi 2008, section 2.3; from memory),
 * for s between massMin^2 and m_h^2.
 */
export function sampleZGammaMass(higgsMass: number, zMass: number, zWidth: number, massMin: number, rng: RandomStream): number {
  const mh2 = higgsMass * higgsMass;
  const sLow = massMin * massMin;
  const wMax = (1 - sLow / mh2) ** 3;
  for (;;) {
    const s = sampleBreitWignerS(zMass, zWidth, sLow, mh2, rng);
    if (rng.uniform() * wMax <= (1 - s / mh2) ** 3) return Math.sqrt(s);
  }
}
