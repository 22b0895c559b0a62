import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { boostFromRestFrame, mass, setPxPyPzE, setPtEtaPhiM } from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';
import { boostFromRest, threeBodyAtRest, threeBodyFlatAtRest, twoBodyAtRest } from '../../src/generator/decays/restFrame.js';
import { expectClose } from '../helpers.js';

/** p-value of a chi-square of counts in equal-probability bins. */
function uniformityPValue(bins: Float64Array): number {
  const n = bins.reduce((a, b) => a + b, 0);
  const e = n / bins.length;
  let chi2 = 0;
  for (const c of bins) chi2 += (c - e) ** 2 / e;
  return 1 - jStat.chisquare.cdf(chi2, bins.length - 1);
}

describe('rest-frame decay kinematics', () => {
  it('twoBodyAtRest: back-to-back daughters on shell whose energies sum to the parent mass', () => {
    const p = new Float64Array(12);
    twoBodyAtRest(p, 1, 2, 172.57, 4.7, 80.3692, 0.3, 1.1);
    expectClose(mass(p, 1), 4.7, { rel: 1e-12 });
    expectClose(mass(p, 2), 80.3692, { rel: 1e-12 });
    expect(p[7]! + p[11]!).toBe(172.57);
    for (let c = 0; c < 3; c++) expect(p[4 + c]! + p[8 + c]!).toBe(0);
    // p* = lambda^(1/2)(m_t^2, m_b^2, M_W^2) / 2 m_t (PDG Review, "Kinematics").
    const l = (172.57 ** 2 - (80.3692 + 4.7) ** 2) * (172.57 ** 2 - (80.3692 - 4.7) ** 2);
    expectClose(Math.hypot(p[4]!, p[5]!, p[6]!), Math.sqrt(l) / (2 * 172.57), { rel: 1e-12 });
    expectClose(p[6]! / Math.hypot(p[4]!, p[5]!, p[6]!), 0.3, { rel: 1e-12 });
  });

  it('boostFromRest agrees with the velocity boost of the physics core and keeps sums exact at gamma ~ 3000', () => {
    const rng = RandomStream.forStream(1201);
    const frame = new Float64Array(4);
    const rest = new Float64Array(12);
    const a = new Float64Array(4);
    const b = new Float64Array(4);
    for (let k = 0; k < 1000; k++) {
      setPtEtaPhiM(frame, 0, 200 * rng.uniform(), 4 * rng.uniform() - 2, 1, 50);
      setPxPyPzE(rest, 0, rng.normal(), rng.normal(), rng.normal(), 5);
      boostFromRest(rest, 0, frame, 0, 50, a, 0);
      b.set(rest.subarray(0, 4));
      boostFromRestFrame(b, 0, frame, 0);
      for (let c = 0; c < 4; c++) expectClose(a[c]!, b[c]!, { abs: 1e-12 * frame[3]! });
    }
    setPtEtaPhiM(frame, 0, 3000 * 1.77693, 2.5, 0.4, 1.77693);
    // As in the decayer: one mass, the four-vector's, for the rest-frame decay and for the boost.
    const m = mass(frame, 0);
    twoBodyAtRest(rest, 1, 2, m, 0.13957, 0, 0.2, 2.0);
    const out = new Float64Array(12);
    boostFromRest(rest, 1, frame, 0, m, out, 1);
    boostFromRest(rest, 2, frame, 0, m, out, 2);
    for (let c = 0; c < 4; c++) expectClose(out[4 + c]! + out[8 + c]!, frame[c]!, { abs: 1e-13 * frame[3]! });
  });

  it('threeBodyAtRest rejects points outside the Dalitz region and builds on-shell, balanced daughters inside it', () => {
    const rng = RandomStream.forStream(1202);
    const p = new Float64Array(16);
    expect(threeBodyAtRest(p, 1, 2, 3, 10, 1, 2, 3, 100, 5, rng)).toBe(false);
    for (let k = 0; k < 2000; k++) {
      threeBodyFlatAtRest(p, 1, 2, 3, 10, 1, 2, 3, rng);
      expectClose(mass(p, 1), 1, { rel: 1e-9 });
      expectClose(mass(p, 2), 2, { rel: 1e-9 });
      expectClose(mass(p, 3), 3, { rel: 1e-9 });
      for (let c = 0; c < 3; c++) expectClose(p[4 + c]! + p[8 + c]! + p[12 + c]!, 0, { abs: 1e-12 });
      expectClose(p[7]! + p[11]! + p[15]!, 10, { rel: 1e-15 });
    }
  });

  it('threeBodyFlatAtRest is flat in the Dalitz plot and isotropic in orientation', () => {
    // Massless daughters: dGamma/dm12^2 ∝ M^2 - m12^2 (length of the Dalitz slice), so
    // P(m12^2 < x M^2) = 1 - (1 - x)^2; the direction of particle 1 and the normal of the
    // decay plane are uniform on the sphere. Thresholds p > 1e-3 (fixed seed).
    const rng = RandomStream.forStream(1203);
    const p = new Float64Array(16);
    const n = 100_000;
    const dalitz = new Float64Array(20);
    const direction = new Float64Array(20);
    const normal = new Float64Array(20);
    const azimuth = new Float64Array(20);
    for (let k = 0; k < n; k++) {
      threeBodyFlatAtRest(p, 1, 2, 3, 1, 0, 0, 0, rng);
      const m12sq = (p[7]! + p[11]!) ** 2 - (p[4]! + p[8]!) ** 2 - (p[5]! + p[9]!) ** 2 - (p[6]! + p[10]!) ** 2;
      dalitz[Math.min(19, Math.floor((1 - (1 - m12sq) ** 2) * 20))]! += 1;
      const r1 = Math.hypot(p[4]!, p[5]!, p[6]!);
      direction[Math.min(19, Math.floor(((p[6]! / r1 + 1) / 2) * 20))]! += 1;
      azimuth[Math.min(19, Math.floor(((Math.atan2(p[5]!, p[4]!) + Math.PI) / (2 * Math.PI)) * 20))]! += 1;
      const nx = p[5]! * p[14]! - p[6]! * p[13]!;
      const ny = p[6]! * p[12]! - p[4]! * p[14]!;
      const nz = p[4]! * p[13]! - p[5]! * p[12]!;
      normal[Math.min(19, Math.floor(((nz / Math.hypot(nx, ny, nz) + 1) / 2) * 20))]! += 1;
    }
    for (const bins of [dalitz, direction, azimuth, normal]) expect(uniformityPValue(bins)).toBeGreaterThan(1e-3);
  });
});
