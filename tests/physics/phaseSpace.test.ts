import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { dot, mass, setPtEtaPhiM, setPxPyPzE } from '../../src/physics/fourVector.js';
import { isotropicTwoBodyDecay, kallen, threeBodyDecayFlat, twoBodyDecay, twoBodyMomentum } from '../../src/physics/phaseSpace.js';
import { RandomStream } from '../../src/physics/random.js';
import { boostToRestFrame } from '../../src/physics/fourVector.js';
import { expectClose } from '../helpers.js';

function expectConserved(p: Float64Array, parent: number, daughters: number[]): void {
  const scale = p[4 * parent + 3]!;
  for (let c = 0; c < 4; c++) {
    let sum = 0;
    for (const d of daughters) sum += p[4 * d + c]!;
    expectClose(sum, p[4 * parent + c]!, { abs: 1e-9 * scale });
  }
}

describe('two-body phase space', () => {
  it('twoBodyMomentum(91.188, 0, 0) is M/2 and uses the Kallen function', () => {
    expectClose(twoBodyMomentum(91.188, 0, 0), 45.594, { rel: 1e-14 });
    expect(kallen(100, 0, 0)).toBe(10000);
    // t -> b W with m_b = 0: p* = (m_t^2 - M_W^2) / (2 m_t)
    expectClose(twoBodyMomentum(172.57, 80.3692, 0), (172.57 ** 2 - 80.3692 ** 2) / (2 * 172.57), { rel: 1e-12 });
    expect(() => twoBodyMomentum(10, 6, 5)).toThrow(/below threshold/);
  });

  it('conserves energy and momentum (1e-9 relative) and puts daughters on shell', () => {
    const rng = RandomStream.forStream(21);
    const p = new Float64Array(12);
    for (let k = 0; k < 2000; k++) {
      setPtEtaPhiM(p, 0, 800 * rng.uniform(), 6 * rng.uniform() - 3, 2 * Math.PI * rng.uniform() - Math.PI, 300 + 200 * rng.uniform());
      const m1 = 172.57 * rng.uniform();
      const m2 = 80 * rng.uniform();
      isotropicTwoBodyDecay(p, 0, m1, m2, rng, p, 1, 2);
      expectConserved(p, 0, [1, 2]);
      expectClose(mass(p, 1), m1, { abs: 1e-6 * p[7]! });
      expectClose(mass(p, 2), m2, { abs: 1e-6 * p[11]! });
    }
  });

  it('is isotropic in the rest frame: chi-square of cos(theta) in 20 bins has p > 1e-3 (fixed seed)', () => {
    // p-value threshold 1e-3: a fixed seed makes the test deterministic; a wrong
    // angular distribution (e.g. uniform theta instead of uniform cos theta) gives p ~ 0.
    const rng = RandomStream.forStream(22);
    const p = new Float64Array(12);
    const bins = new Float64Array(20);
    const n = 100_000;
    for (let k = 0; k < n; k++) {
      setPtEtaPhiM(p, 0, 200, 1.0, 0.5, 500);
      isotropicTwoBodyDecay(p, 0, 10, 20, rng, p, 1, 2);
      boostToRestFrame(p, 1, p, 0);
      const cosTheta = p[6]! / Math.hypot(p[4]!, p[5]!, p[6]!);
      bins[Math.min(19, Math.floor((cosTheta + 1) * 10))]! += 1;
    }
    let chi2 = 0;
    for (const c of bins) chi2 += (c - n / 20) ** 2 / (n / 20);
    expect(1 - jStat.chisquare.cdf(chi2, 19)).toBeGreaterThan(1e-3);
  });

  it('measures helicity angles about a given axis', () => {
    const p = new Float64Array(12);
    setPxPyPzE(p, 0, 0, 0, 0, 100);
    twoBodyDecay(p, 0, 0, 0, 1, 0, p, 1, 2, [1, 1, 0]);
    expectClose(p[4]!, 50 / Math.SQRT2, { rel: 1e-12 });
    expectClose(p[5]!, 50 / Math.SQRT2, { rel: 1e-12 });
    expectClose(p[6]!, 0, { abs: 1e-12 });
  });
});

describe('three-body phase space', () => {
  it('conserves energy and momentum, puts daughters on shell, and fills the Dalitz plot flatly', () => {
    const rng = RandomStream.forStream(23);
    const p = new Float64Array(16);
    const bigM = 1.77693;
    const m1 = 0.105;
    // Flat phase space: the m12^2 distribution is proportional to the length of the
    // Dalitz slice; for massless 2 and 3 and m1 ~ 0, d Gamma / d m12^2 ~ (M^2 - m12^2),
    // so the mean of m12^2 / M^2 is 1/3.
    let sum = 0;
    const n = 50_000;
    for (let k = 0; k < n; k++) {
      setPtEtaPhiM(p, 0, 30, -0.5, 2, bigM);
      threeBodyDecayFlat(p, 0, 0, 0, 0, rng, p, 1, 2, 3);
      expectConserved(p, 0, [1, 2, 3]);
      const m12sq = 2 * dot(p, 1, p, 2);
      sum += m12sq / (bigM * bigM);
    }
    expectClose(sum / n, 1 / 3, { abs: 5 * Math.sqrt(1 / 18 / n) });
    setPtEtaPhiM(p, 0, 30, -0.5, 2, bigM);
    threeBodyDecayFlat(p, 0, m1, 0, 0, rng, p, 1, 2, 3);
    expectClose(mass(p, 1), m1, { abs: 1e-6 });
  });
});
