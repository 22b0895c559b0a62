import { describe, expect, it } from 'vitest';
import { asimovDiscoverySignificance, medianDiscoverySignificance } from '../../src/stats/discovery.js';
import { expectClose } from '../helpers.js';

// Cowan, Cranmer, Gross, Vitells, Eur. Phys. J. C 71 (2011) 1554, eq. (97):
// Z_A = sqrt(2 ((s + b) ln(1 + s/b) - s)); values recomputed in ../shared/checks.md section 2 [C].
const CASES: [number, number, number][] = [
  [1, 1, 0.879],
  [5, 10, 1.471],
  [10, 100, 0.984],
];

describe('median discovery significance of the Asimov data set', () => {
  it.each(CASES)('Z_A(s=%d, b=%d) = %d (closed form, eq. 97)', (s, b, z) => {
    expectClose(asimovDiscoverySignificance(s, b), z, { abs: 5e-5 });
  });

  it.each(CASES)('tamis profile likelihood on the Asimov data set reproduces Z_A(s=%d, b=%d) = %d', (s, b, z) => {
    expectClose(medianDiscoverySignificance([{ observed: 0, background: b, signal: s }]), z, { abs: 5e-5 });
    expectClose(medianDiscoverySignificance([{ observed: 0, background: b, signal: s }]), asimovDiscoverySignificance(s, b), { rel: 1e-9 });
  });

  it('adds in quadrature over independent regions and drops with a background uncertainty', () => {
    const one = asimovDiscoverySignificance(5, 10);
    expectClose(medianDiscoverySignificance([
      { observed: 0, background: 10, signal: 5 },
      { observed: 0, background: 10, signal: 5 },
    ]), Math.SQRT2 * one, { rel: 1e-9 });
    const withUncertainty = medianDiscoverySignificance([{ observed: 0, background: 10, backgroundUncertainty: 3, signal: 5 }]);
    expect(withUncertainty).toBeLessThan(one);
    expect(withUncertainty).toBeGreaterThan(0);
  });

  it('is 0 without signal and infinite with signal and no background', () => {
    expect(asimovDiscoverySignificance(0, 3)).toBe(0);
    expect(asimovDiscoverySignificance(2, 0)).toBe(Number.POSITIVE_INFINITY);
    expect(() => asimovDiscoverySignificance(-1, 3)).toThrow(/must be >= 0/);
  });
});
