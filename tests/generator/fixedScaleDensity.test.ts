import { describe, expect, it } from 'vitest';
import { lesHouchesToyDensities } from '../../src/physics/pdf/index.js';
import { RandomStream } from '../../src/physics/random.js';
import { FixedScaleDensity } from '../../src/generator/fixedScaleDensity.js';

describe('FixedScaleDensity', () => {
  const pdf = lesHouchesToyDensities();

  it('reproduces the densities it tabulates to 1e-5 relative (4-point Lagrange, step 0.01 in ln(x/(1-x)))', () => {
    const rng = RandomStream.forStream(17);
    const direct = new Float64Array(13);
    const table = new Float64Array(13);
    let worst = 0;
    for (const q of [100, 300, 2000]) {
      const density = new FixedScaleDensity(pdf, q, 1e-4);
      for (let n = 0; n < 5000; n++) {
        // log-uniform x in [1e-4, 0.999]
        const x = 1e-4 * Math.exp(rng.uniform() * Math.log(0.999 / 1e-4));
        pdf.xfxAll(x, q, direct);
        density.xfxAll(x, table);
        for (let f = 0; f < 13; f++) {
          if (direct[f]! > 1e-8) worst = Math.max(worst, Math.abs(table[f]! / direct[f]! - 1));
          else expect(Math.abs(table[f]! - direct[f]!)).toBeLessThan(1e-8);
        }
      }
    }
    // Measured 2.2e-6: the kinks of the underlying grid interpolation dominate.
    expect(worst).toBeLessThan(1e-5);
  });

  it('falls back to the densities themselves outside the table and never returns negative values', () => {
    const density = new FixedScaleDensity(pdf, 200, 1e-3);
    const a = new Float64Array(13);
    const b = new Float64Array(13);
    for (const x of [1e-5, 1 - 1e-7, 1]) {
      density.xfxAll(x, a);
      pdf.xfxAll(x, 200, b);
      expect(Array.from(a)).toEqual(Array.from(b));
    }
    density.xfxAll(0.9999, a);
    for (const v of a) expect(v).toBeGreaterThanOrEqual(0);
  });
});
