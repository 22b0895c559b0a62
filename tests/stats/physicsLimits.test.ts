import { describe, expect, it } from 'vitest';
import { analysisLimits } from '../../src/stats/analysisLimits.js';
import {
  bestExpectedRegion, comparePublished, crossSectionLimit, exclusionRatio, signalEvents, signalUncertaintyWithEfficiency,
} from '../../src/stats/physicsLimits.js';
import { upperLimit } from '../../src/stats/upperLimit.js';
import { expectClose } from '../helpers.js';

describe('from signal counts to cross sections (L in fb^-1, sigma in pb, 1 fb^-1 = 1000 pb^-1)', () => {
  it('doc examples: events, sigma95, folded efficiency error, r, best region, published ratio', () => {
    expectClose(signalEvents(0.01, 20.3, 0.05), 10.15, { rel: 1e-12 });
    expectClose(crossSectionLimit(3.0, 20.3, 0.05), 0.0029556650246305416, { rel: 1e-12 });
    expectClose(signalUncertaintyWithEfficiency(0.05, 0.004, 0.06), 0.1, { rel: 1e-12 });
    expect(exclusionRatio(0.006, 0.003)).toBe(2);
    expect(bestExpectedRegion([0.8, 0.2, Number.POSITIVE_INFINITY, 0.5])).toBe(1);
    expect(comparePublished(4.9, 5.0)).toEqual({ tamis: 4.9, published: 5, ratio: 0.9800000000000001 });
  });

  it('sigma95 and the signal count are inverse: sigma95 produces exactly N95 events', () => {
    const n95 = 7.3;
    const sigma = crossSectionLimit(n95, 139, 0.0123);
    expectClose(signalEvents(sigma, 139, 0.0123), n95, { rel: 1e-12 });
  });

  it('tiny efficiencies give large finite limits; zero efficiency gives Infinity and r = 0', () => {
    const tiny = crossSectionLimit(3, 20, 1e-9);
    expect(Number.isFinite(tiny)).toBe(true);
    expectClose(tiny, 3 / (20 * 1000 * 1e-9), { rel: 1e-12 });
    expect(crossSectionLimit(3, 20, 0)).toBe(Number.POSITIVE_INFINITY);
    expect(exclusionRatio(1, Number.POSITIVE_INFINITY)).toBe(0);
    expect(bestExpectedRegion([Number.POSITIVE_INFINITY, Number.POSITIVE_INFINITY])).toBe(-1);
  });

  it('rejects impossible inputs', () => {
    expect(() => crossSectionLimit(3, 0, 0.1)).toThrow(/luminosity must be a finite number > 0/);
    expect(() => crossSectionLimit(3, 20, 1.5)).toThrow(/efficiency must be in \[0, 1\]/);
    expect(() => signalUncertaintyWithEfficiency(0.1, -0.01)).toThrow(/efficiency error must be >= 0/);
    expect(() => comparePublished(3, 0)).toThrow(/publishedN95/);
  });
});

describe('analysisLimits (one model point, one analysis)', () => {
  const regions = [
    { name: 'SR-low', observed: 14, background: 11.2, backgroundUncertainty: 2.4, efficiency: 0.004, efficiencyError: 0.0003 },
    { name: 'SR-mid', observed: 3, background: 2.1, backgroundUncertainty: 0.6, efficiency: 0.009, efficiencyError: 0.0005, publishedN95: 5.9 },
    { name: 'SR-high', observed: 0, background: 0.4, backgroundUncertainty: 0.2, efficiency: 0.002, efficiencyError: 0.0002 },
  ];

  it('quotes per-region sigma95 = N95 / (L eff) and r = sigma_model / sigma95, with the efficiency error folded in', () => {
    const result = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15 }, { seed: 4 });
    const mid = result.regions[1];
    expect(mid.name).toBe('SR-mid');
    expectClose(mid.signal, 0.15 * 1000 * 20.3 * 0.009, { rel: 1e-12 });
    expectClose(mid.sigma95.observed, mid.n95.observed / (20.3 * 1000 * 0.009), { rel: 1e-12 });
    expectClose(mid.sigma95.rObserved, 0.15 / mid.sigma95.observed, { rel: 1e-12 });
    expectClose(mid.sigma95.rExpected, 0.15 / mid.sigma95.expected.median, { rel: 1e-12 });
    // Folding the 5.6% efficiency error in weakens the limit a little.
    const unfolded = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15, foldEfficiencyError: false }, { seed: 4 });
    expect(mid.n95.observed).toBeGreaterThan(unfolded.regions[1].n95.observed);
    expect(mid.published?.observed?.published).toBe(5.9);
    expectClose(mid.published?.observed?.ratio ?? 0, mid.n95.observed / 5.9, { rel: 1e-12 });
  });

  it('picks the region with the best expected limit and quotes its observed limit', () => {
    const result = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15 }, { seed: 4 });
    const expected = result.regions.map((r) => r.sigma95.expected.median);
    expect(result.bestRegion).toBe(expected.indexOf(Math.min(...expected)));
  });

  it('the combination of the disjoint regions is at least as strong as the best region', () => {
    const result = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15 }, { seed: 4 });
    const best = result.regions[result.bestRegion];
    expect(result.combined).toBeDefined();
    expect(result.combined!.sigma95.expected.median).toBeLessThan(best.sigma95.expected.median);
    expectClose(result.combined!.sigma95.rObserved, 0.15 / result.combined!.sigma95.observed, { rel: 1e-12 });
  });

  it('is reproducible for a seed, and a region with zero efficiency is reported as insensitive', () => {
    const a = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15 }, { seed: 9 });
    const b = analysisLimits(regions, { luminosity: 20.3, crossSection: 0.15 }, { seed: 9 });
    expect(b).toEqual(a);
    const blind = analysisLimits([{ ...regions[0], efficiency: 0, efficiencyError: 0 }], { luminosity: 20.3, crossSection: 0.15 });
    expect(blind.regions[0].sigma95.observed).toBe(Number.POSITIVE_INFINITY);
    expect(blind.regions[0].sigma95.rObserved).toBe(0);
    expect(blind.bestRegion).toBe(-1);
    expect(upperLimit(regions[0]).observed).toBeGreaterThan(0);
  });

  it('rejects bad efficiencies and luminosities', () => {
    expect(() => analysisLimits([{ ...regions[0], efficiency: 2 }], { luminosity: 20, crossSection: 1 })).toThrow(/efficiency must be in \[0, 1\]/);
    expect(() => analysisLimits(regions, { luminosity: -1, crossSection: 1 })).toThrow(/luminosity must be > 0/);
    expect(() => analysisLimits([], { luminosity: 1, crossSection: 1 })).toThrow(/at least one region/);
  });
});
