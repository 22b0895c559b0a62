/**
 * W helicity fractions in top decay. The charged lepton's (or the down-type
 * antiquark's) angle theta* in the W rest frame, measured from the W
 * direction in the top rest frame, follows
 *   dN/dcos = 3/4 F0 sin^2 + 3/8 FL (1 - cos)^2 + 3/8 FR (1 + cos)^2
 * (../shared/checks.md, section 4), so F0 = 2 - 5 <cos^2> and
 * FL - FR = -2 <cos>; the errors come from the sample variances.
 */
import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { M_B, M_TOP, M_W } from '../../src/physics/constants.js';
import { boostToRestFrame, setPtEtaPhiM } from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';
import { EventRecord, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { ParticleTable, STANDARD_MODEL_PARTICLES } from '../../src/generator/particles.js';
import { createDecayer, helicityFractionsLO } from '../../src/generator/decays/index.js';
import { expectClose } from '../helpers.js';

interface Measured {
  f0: number;
  fl: number;
  fr: number;
  sigmaF0: number;
  sigmaDiff: number;
  cosines: Float64Array;
}

/** Decays `n` tops (half of them antitops) in flight and measures the helicity fractions. */
function measureHelicity(particles: ParticleTable, n: number, seed: number): Measured {
  const decayer = createDecayer(particles, [], { stable: [15, -15] });
  const record = new EventRecord();
  const rng = RandomStream.forStream(seed);
  const scratch = new Float64Array(12);
  const cosines = new Float64Array(n);
  let s1 = 0;
  let s2 = 0;
  let s4 = 0;
  for (let k = 0; k < n; k++) {
    record.clear();
    const id = k % 2 === 0 ? 6 : -6;
    record.add(id, STATUS_FINAL, -1, -1, 0, 0, 0, 0, M_TOP);
    setPtEtaPhiM(record.momentum, 0, 300 * rng.uniform(), 4 * rng.uniform() - 2, 2 * Math.PI * rng.uniform() - Math.PI, M_TOP);
    decayer.decayAll(record, rng);
    // Record: 0 top, 1 quark, 2 W, 3 first W daughter (l+ / dbar for W+; l- / d for W-), 4 second.
    const p = record.momentum;
    for (let c = 0; c < 4; c++) {
      scratch[c] = p[8 + c]!; // W
      scratch[4 + c] = p[12 + c]!; // first W daughter
    }
    const top = p.subarray(0, 4);
    // W direction in the top rest frame.
    boostToRestFrame(scratch, 0, top, 0);
    const wx = scratch[0]!;
    const wy = scratch[1]!;
    const wz = scratch[2]!;
    // Daughter in the W rest frame reached from the top rest frame.
    boostToRestFrame(scratch, 1, top, 0);
    boostToRestFrame(scratch, 1, scratch, 0);
    const dx = scratch[4]!;
    const dy = scratch[5]!;
    const dz = scratch[6]!;
    const c = (dx * wx + dy * wy + dz * wz) / (Math.hypot(dx, dy, dz) * Math.hypot(wx, wy, wz));
    cosines[k] = c;
    s1 += c;
    s2 += c * c;
    s4 += c * c * c * c;
  }
  const m1 = s1 / n;
  const m2 = s2 / n;
  const m4 = s4 / n;
  const f0 = 2 - 5 * m2;
  const diff = -2 * m1;
  return {
    f0,
    fl: (1 - f0 + diff) / 2,
    fr: (1 - f0 - diff) / 2,
    sigmaF0: 5 * Math.sqrt((m4 - m2 * m2) / n),
    sigmaDiff: 2 * Math.sqrt((m2 - m1 * m1) / n),
    cosines,
  };
}

describe('W helicity fractions in top decay', () => {
  it('LO formula: with m_b = 0, F0 = m_t^2 / (m_t^2 + 2 M_W^2) = 0.6975, FL = 0.3025, FR = 0 (checks.md section 4)', () => {
    const lo = helicityFractionsLO(M_TOP, M_W, 0);
    expectClose(lo.f0, (M_TOP * M_TOP) / (M_TOP * M_TOP + 2 * M_W * M_W), { rel: 1e-12 });
    expectClose(lo.f0, 0.6975, { abs: 5e-5 });
    expectClose(lo.fl, 0.3025, { abs: 5e-5 });
    expectClose(lo.fr, 0, { abs: 1e-12 });
    // The b mass of constants.ts (4.7 GeV) moves F0 by -6.4e-4 and opens FR = 3.7e-4 [C: same formula].
    const massive = helicityFractionsLO(M_TOP, M_W, M_B);
    expectClose(massive.f0, 0.69681, { abs: 1e-5 });
    expectClose(massive.fr, 3.66e-4, { abs: 1e-5 });
  });

  it('massless b: 1e6 decays reproduce the LO values within 3 sigma', () => {
    const massless = new ParticleTable(STANDARD_MODEL_PARTICLES.map((p) => (p.id === 5 ? { ...p, mass: 0 } : p)));
    const m = measureHelicity(massless, 1_000_000, 501);
    expect(Math.abs(m.f0 - 0.697452619)).toBeLessThan(3 * m.sigmaF0);
    // FL - FR = 0.3025 - 0 with m_b = 0.
    expect(Math.abs(m.fl - m.fr - 0.302547381)).toBeLessThan(3 * m.sigmaDiff);
  });

  it('with m_b = 4.7 GeV: the measured fractions match the massive LO values and lie near the NNLO ones', () => {
    const m = measureHelicity(new ParticleTable(), 1_000_000, 502);
    const lo = helicityFractionsLO(M_TOP, M_W, M_B);
    expect(Math.abs(m.f0 - lo.f0)).toBeLessThan(3 * m.sigmaF0);
    expect(Math.abs(m.fl - m.fr - (lo.fl - lo.fr))).toBeLessThan(3 * m.sigmaDiff);
    // NNLO QCD: F0 = 0.687(5), FL = 0.311(5), FR = 0.0017(1) (Czarnecki, Koerner, Piclum,
    // arXiv:1005.2625 [P], via checks.md). LO and NNLO differ by ~0.01, so the tolerance is 0.015.
    expect(Math.abs(m.f0 - 0.687)).toBeLessThan(0.015);
    expect(Math.abs(m.fl - 0.311)).toBeLessThan(0.015);
    expect(Math.abs(m.fr - 0.0017)).toBeLessThan(0.005);
    // Shape: chi-square of cos(theta*) in 20 bins against the helicity formula, p > 1e-3.
    const bins = new Float64Array(20);
    for (const c of m.cosines) bins[Math.min(19, Math.floor((c + 1) * 10))]! += 1;
    const cdf = (x: number): number =>
      // Integral of 3/4 F0 (1 - c^2) + 3/8 FL (1 - c)^2 + 3/8 FR (1 + c)^2 from -1 to x.
      (3 / 4) * lo.f0 * (x - x ** 3 / 3 + 2 / 3) + (1 / 8) * lo.fl * (8 - (1 - x) ** 3) + (1 / 8) * lo.fr * (1 + x) ** 3;
    let chi2 = 0;
    for (let b = 0; b < 20; b++) {
      const expected = m.cosines.length * (cdf(-1 + (b + 1) / 10) - cdf(-1 + b / 10));
      chi2 += (bins[b]! - expected) ** 2 / expected;
    }
    expect(1 - jStat.chisquare.cdf(chi2, 19)).toBeGreaterThan(1e-3);
  });
});
