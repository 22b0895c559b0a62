/**
 * h -> W W* and Z Z*: off-shell masses inside the kinematic limits and
 * distributed as BW(s1) BW(s2) sqrt(lambda)(lambda + 12 x1 x2) (Djouadi,
 * hep-ph/0503172, section 2.2; from memory), checked against a numerical
 * integration of that density.
 */
import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { GAMMA_W, GAMMA_Z, M_E, M_H, M_W, M_Z } from '../../src/physics/constants.js';
import { RandomStream } from '../../src/physics/random.js';
import { EventRecord, STATUS_FINAL } from '../../src/generator/eventRecord.js';
import { ParticleTable } from '../../src/generator/particles.js';
import { createDecayer, vectorPairWeight } from '../../src/generator/decays/index.js';
import { breitWignerDensityS } from '../../src/generator/decays/breitWigner.js';
import { sampleZGammaMass } from '../../src/generator/decays/higgsDecay.js';

const particles = new ParticleTable();

describe('off-shell vector bosons in Higgs decays', () => {
  it('vectorPairWeight is 1 at x1 = x2 = 0, at most 1 and zero on the kinematic boundary', () => {
    expect(vectorPairWeight(0, 0)).toBe(1);
    let max = 0;
    for (let i = 0; i <= 400; i++) {
      for (let j = 0; j <= 400; j++) {
        const x1 = i / 400;
        const x2 = j / 400;
        const w = vectorPairWeight(x1, x2);
        max = Math.max(max, w);
        const edge = Math.sqrt(x1) + Math.sqrt(x2);
        // Zero outside the region, vanishing (up to rounding) on its edge.
        if ((edge > 1 + 1e-9 && w !== 0) || (edge >= 1 - 1e-12 && w > 1e-6)) expect.fail(`weight ${w} at the edge or outside, x = ${x1}, ${x2}`);
      }
    }
    expect(max).toBe(1);
  });

  it('W W*: both masses above the lightest channel, their sum below m_h; the lighter mass follows the density', () => {
    const decayer = createDecayer(particles, [], { stable: [24, -24] });
    const record = new EventRecord();
    const rng = RandomStream.forStream(701);
    const n = 100_000;
    const nb = 20;
    const top = M_H / 2;
    const bins = new Float64Array(nb);
    let taken = 0;
    while (taken < n) {
      record.clear();
      record.add(25, STATUS_FINAL, -1, -1, 0, 0, 0, M_H, M_H);
      decayer.decayAll(record, rng);
      if (record.pdgId[1] !== 24) continue;
      taken++;
      const m1 = record.mass[1]!;
      const m2 = record.mass[2]!;
      if (m1 + m2 > M_H || m1 < M_E || m2 < M_E) expect.fail(`masses ${m1}, ${m2}`);
      const light = Math.min(m1, m2);
      bins[Math.min(nb - 1, Math.floor((light / top) * nb))]! += 1;
    }
    // Expected distribution of the lighter mass: integrate BW(s1) BW(s2) weight over s1 (the heavier) by
    // the midpoint rule in theta = atan((s - M^2)/(M Gamma)), which absorbs the Breit-Wigner peak.
    const mh2 = M_H * M_H;
    const density = (light: number): number => {
      const s2 = light * light;
      const sMax = (M_H - light) ** 2;
      const t0 = Math.atan((s2 - M_W * M_W) / (M_W * GAMMA_W));
      const t1 = Math.atan((sMax - M_W * M_W) / (M_W * GAMMA_W));
      let integral = 0;
      const steps = 400;
      for (let k = 0; k < steps; k++) {
        const s1 = M_W * M_W + M_W * GAMMA_W * Math.tan(t0 + ((k + 0.5) * (t1 - t0)) / steps);
        integral += vectorPairWeight(s1 / mh2, s2 / mh2);
      }
      integral *= (t1 - t0) / steps; // ∫ BW(s1) ds1 = ∫ dtheta / (M Gamma), constant factors dropped
      return 2 * light * breitWignerDensityS(M_W, GAMMA_W, 0, mh2, s2) * integral;
    };
    const expected = new Float64Array(nb);
    let total = 0;
    for (let b = 0; b < nb; b++) {
      let s = 0;
      for (let k = 0; k < 50; k++) s += density(((b + (k + 0.5) / 50) * top) / nb);
      expected[b] = s;
      total += s;
    }
    let chi2 = 0;
    let dof = 0;
    for (let b = 0; b < nb; b++) {
      const e = (n * expected[b]!) / total;
      if (e < 5) continue;
      chi2 += (bins[b]! - e) ** 2 / e;
      dof++;
    }
    // The 50-point midpoint rule per bin is accurate to ~1e-4 relative, well below the
    // statistical resolution of 1e5 decays; threshold p > 1e-3 (fixed seed).
    expect(1 - jStat.chisquare.cdf(chi2, dof - 1)).toBeGreaterThan(1e-3);
  });

  it('Z Z*: masses inside the limits and the decay chain reaches the Z* daughters', () => {
    const decayer = createDecayer(particles, []);
    const record = new EventRecord();
    const rng = RandomStream.forStream(702);
    let taken = 0;
    while (taken < 5000) {
      record.clear();
      record.add(25, STATUS_FINAL, -1, -1, 0, 0, 0, M_H, M_H);
      decayer.decayAll(record, rng);
      if (record.pdgId[1] !== 23 || record.pdgId[2] !== 23) continue;
      taken++;
      const m1 = record.mass[1]!;
      const m2 = record.mass[2]!;
      if (m1 + m2 > M_H || Math.max(m1, m2) > M_H) expect.fail(`masses ${m1}, ${m2}`);
      // A Z* lighter than the b-quark pair threshold (9.4 GeV) never decays to b bbar.
      for (let j = 3; j < record.size; j++) {
        const mother = record.mother1[j]!;
        if (Math.abs(record.pdgId[j]!) === 5 && mother > 0 && record.mass[mother]! < 9.4) expect.fail('closed channel used');
      }
    }
  });

  it('h -> Z gamma: the Z mass stays below m_h and peaks at M_Z', () => {
    const rng = RandomStream.forStream(703);
    let near = 0;
    for (let k = 0; k < 10_000; k++) {
      const m = sampleZGammaMass(M_H, M_Z, GAMMA_Z, 0, rng);
      if (!(m > 0 && m < M_H)) expect.fail(`mass ${m}`);
      if (Math.abs(m - M_Z) < 2 * GAMMA_Z) near++;
    }
    // Most of the Breit-Wigner lies within 2 widths of the peak (2/pi atan(4) = 0.84 untruncated;
    // the (1 - s/m_h^2)^3 factor shifts weight to lower masses).
    expect(near / 10_000).toBeGreaterThan(0.6);
  });
});
