import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { RandomStream, mix32 } from '../../src/physics/random.js';
import { expectClose } from '../helpers.js';

describe('RandomStream', () => {
  it('gives the same sequence for the same seed and stream path', () => {
    const a = RandomStream.forStream(2026, 3, 1);
    const b = RandomStream.forStream(2026, 3, 1);
    for (let i = 0; i < 1000; i++) expect(a.nextUint32()).toBe(b.nextUint32());
  });

  it('gives different sequences for different seeds or stream ids', () => {
    const first = (r: RandomStream) => [r.nextUint32(), r.nextUint32(), r.nextUint32()].join(',');
    const seen = new Set([
      first(RandomStream.forStream(1)),
      first(RandomStream.forStream(2)),
      first(RandomStream.forStream(1, 0)),
      first(RandomStream.forStream(1, 1)),
      first(RandomStream.forStream(1, 0, 0)),
      first(RandomStream.forStream(1, 0, 1)),
      first(RandomStream.forStream(2 ** 40, 0)),
      first(RandomStream.forStream(0, 2 ** 40)),
    ]);
    expect(seen.size).toBe(8);
  });

  it('produces uniform numbers in [0, 1) with mean 1/2 and variance 1/12', () => {
    const r = RandomStream.forStream(7);
    const n = 200_000;
    let sum = 0;
    let sum2 = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const u = r.uniform();
      if (!(u >= 0 && u < 1)) outside++;
      sum += u;
      sum2 += u * u;
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    // Standard error of the mean: sqrt(1/12 / n) = 6.5e-4; allow 5 sigma.
    expectClose(mean, 0.5, { abs: 5 * Math.sqrt(1 / 12 / n) });
    expectClose(sum2 / n - mean * mean, 1 / 12, { abs: 2e-3 });
  });

  it('passes a chi-square uniformity test on 100 bins (p-value threshold 1e-4, fixed seed)', () => {
    // Threshold documented: with a fixed seed the test is deterministic; 1e-4
    // would flag a broken generator (p ~ 0) while leaving room for an honest one.
    const r = RandomStream.forStream(11);
    const bins = new Float64Array(100);
    const n = 1_000_000;
    for (let i = 0; i < n; i++) bins[Math.floor(r.uniform() * 100)]! += 1;
    let chi2 = 0;
    for (const count of bins) chi2 += (count - n / 100) ** 2 / (n / 100);
    const pValue = 1 - jStat.chisquare.cdf(chi2, 99);
    expect(pValue).toBeGreaterThan(1e-4);
  });

  it('gives uncorrelated neighbouring streams (correlation coefficient within 5 sigma of 0)', () => {
    const n = 100_000;
    for (const [a, b] of [
      [RandomStream.forStream(5, 0), RandomStream.forStream(5, 1)],
      [RandomStream.forStream(5, 0, 0), RandomStream.forStream(5, 0, 1)],
      [RandomStream.forStream(5), RandomStream.forStream(6)],
    ] as const) {
      let sxy = 0;
      let sx = 0;
      let sy = 0;
      let sxx = 0;
      let syy = 0;
      for (let i = 0; i < n; i++) {
        const x = a.uniform();
        const y = b.uniform();
        sx += x;
        sy += y;
        sxy += x * y;
        sxx += x * x;
        syy += y * y;
      }
      const cov = sxy / n - (sx / n) * (sy / n);
      const rho = cov / Math.sqrt((sxx / n - (sx / n) ** 2) * (syy / n - (sy / n) ** 2));
      // Under independence rho ~ N(0, 1/n).
      expect(Math.abs(rho)).toBeLessThan(5 / Math.sqrt(n));
    }
  });

  it('draws standard normal deviates with mean 0 and variance 1', () => {
    const r = RandomStream.forStream(13);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const z = r.normal();
      s += z;
      s2 += z * z;
    }
    expectClose(s / n, 0, { abs: 5 / Math.sqrt(n) });
    expectClose(s2 / n, 1, { abs: 5 * Math.sqrt(2 / n) });
  });

  it('draws integers below n without bias', () => {
    const r = RandomStream.forStream(17);
    const counts = new Float64Array(7);
    const n = 70_000;
    for (let i = 0; i < n; i++) counts[r.integerBelow(7)]! += 1;
    let chi2 = 0;
    for (const c of counts) chi2 += (c - n / 7) ** 2 / (n / 7);
    expect(1 - jStat.chisquare.cdf(chi2, 6)).toBeGreaterThan(1e-4);
  });

  it('jump() equals 2^64 single steps (transition matrix over GF(2) raised to 2^64)', () => {
    // The state update of xoshiro128** is linear over GF(2); its 128x128 matrix T
    // is built column by column from basis states, squared 64 times, and applied
    // to a state: the result must equal what jump() computes.
    type Columns = Uint32Array[]; // column j = T e_j as 4 words
    const step = (state: Uint32Array): Uint32Array => {
      const r = new RandomStream(state[0]!, state[1]!, state[2]!, state[3]!);
      r.nextUint32();
      return Uint32Array.from(r.state());
    };
    const apply = (m: Columns, v: Uint32Array): Uint32Array => {
      const out = new Uint32Array(4);
      for (let j = 0; j < 128; j++) {
        if ((v[j >>> 5]! >>> (j & 31)) & 1) {
          const c = m[j]!;
          out[0]! ^= c[0]!;
          out[1]! ^= c[1]!;
          out[2]! ^= c[2]!;
          out[3]! ^= c[3]!;
        }
      }
      return out;
    };
    let t: Columns = [];
    for (let j = 0; j < 128; j++) {
      const e = new Uint32Array(4);
      e[j >>> 5] = (1 << (j & 31)) >>> 0;
      t.push(step(e));
    }
    for (let k = 0; k < 64; k++) t = t.map((column) => apply(t, column));
    const start = RandomStream.forStream(99, 1);
    const expected = apply(t, Uint32Array.from(start.state()));
    start.jump();
    expect(Array.from(start.state())).toEqual(Array.from(expected));
  });

  it('mix32 is the MurmurHash3 finaliser (reference value computed from its definition)', () => {
    // fmix32(1): h ^= h>>>16 -> 1; *0x85ebca6b; ^>>>13; *0xc2b2ae35; ^>>>16.
    let h = 1;
    h ^= h >>> 16;
    h = Math.imul(h, 0x85ebca6b);
    h ^= h >>> 13;
    h = Math.imul(h, 0xc2b2ae35);
    h ^= h >>> 16;
    expect(mix32(1)).toBe(h >>> 0);
    expect(mix32(0)).toBe(0);
  });

  it('rejects invalid seeds', () => {
    expect(() => RandomStream.forStream(-1)).toThrow(/seed/);
    expect(() => RandomStream.forStream(1.5)).toThrow(/seed/);
  });
});
