import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { RandomStream } from '../../src/physics/random.js';
import { poissonCdf } from '../../src/stats/poisson.js';
import { poissonInverse, samplePoisson } from '../../src/stats/poissonSampling.js';

/** Poisson pmf from jstat's log-gamma (independent of tamis's own log-factorial table). */
function referencePmf(k: number, mean: number): number {
  return Math.exp(k * Math.log(mean) - mean - jStat.gammaln(k + 1));
}

/**
 * Pearson chi-square p-value of samples against the Poisson pmf, over
 * mean ± 12 sigma with neighbouring bins merged until each expects >= 20.
 */
function chiSquarePValue(samples: Int32Array, mean: number): number {
  const low = Math.max(0, Math.floor(mean - 12 * Math.sqrt(mean) - 5));
  const high = Math.ceil(mean + 12 * Math.sqrt(mean) + 10);
  const observed = new Float64Array(high - low + 1);
  for (const k of samples) observed[Math.min(high, Math.max(low, k)) - low]++;
  const total = samples.length;
  let chi2 = 0;
  let bins = 0;
  let expectedBin = 0;
  let observedBin = 0;
  for (let k = low; k <= high; k++) {
    expectedBin += referencePmf(k, mean) * total;
    observedBin += observed[k - low];
    if (expectedBin >= 20 || k === high) {
      chi2 += (observedBin - expectedBin) ** 2 / Math.max(expectedBin, 1e-300);
      bins++;
      expectedBin = 0;
      observedBin = 0;
    }
  }
  return 1 - jStat.chisquare.cdf(chi2, bins - 1);
}

describe('Poisson sampling', () => {
  // Threshold p > 1e-4 with fixed seeds: deterministic, and a wrong sampler
  // (a constant off in PTRS, an off-by-one in the inversion) gives p ~ 0.
  it.each([0.3, 3, 9.99, 10, 25, 140, 1e4])('samplePoisson(mean %d) passes a chi-square test against the Poisson pmf (p > 1e-4)', (mean) => {
    const rng = RandomStream.forStream(4242, Math.round(mean * 100));
    const samples = new Int32Array(200_000);
    for (let i = 0; i < samples.length; i++) samples[i] = samplePoisson(rng, mean);
    expect(chiSquarePValue(samples, mean)).toBeGreaterThan(1e-4);
  });

  it('samplePoisson gives 0 for mean 0 and the same counts for the same seed', () => {
    expect(samplePoisson(RandomStream.forStream(1), 0)).toBe(0);
    const a = RandomStream.forStream(9);
    const b = RandomStream.forStream(9);
    for (let i = 0; i < 1000; i++) expect(samplePoisson(a, 37.5)).toBe(samplePoisson(b, 37.5));
  });

  it('poissonInverse is the smallest count whose cumulative probability reaches u', () => {
    expect(poissonInverse(0.5, 3)).toBe(3);
    const rng = RandomStream.forStream(3);
    for (let i = 0; i < 400; i++) {
      const mean = [0.4, 6, 29.9, 30, 250, 5e4][i % 6];
      const u = rng.uniform();
      const k = poissonInverse(u, mean);
      expect(poissonCdf(k, mean)).toBeGreaterThanOrEqual(u * (1 - 1e-12));
      if (k > 0) expect(poissonCdf(k - 1, mean)).toBeLessThan(u * (1 + 1e-12));
    }
  });

  it('poissonInverse never decreases when the mean grows (common random numbers)', () => {
    const rng = RandomStream.forStream(5);
    for (let i = 0; i < 200; i++) {
      const u = rng.uniform();
      let previous = 0;
      for (let mean = 0.05; mean < 80; mean *= 1.15) {
        const k = poissonInverse(u, mean);
        expect(k).toBeGreaterThanOrEqual(previous);
        previous = k;
      }
    }
  });
});
