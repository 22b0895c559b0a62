import { describe, expect, it } from 'vitest';
import { complex, inverse } from '../../src/physics/pdf/complex.js';
import { LES_HOUCHES_CONTOUR_BANDS, lesHouchesEvolutionSetup, lesHouchesXfDirect } from '../../src/physics/pdf/lesHouchesEvolution.js';
import { lesHouchesInputXf } from '../../src/physics/pdf/lesHouchesInput.js';
import { evolveMoments } from '../../src/physics/pdf/mellinEvolution.js';
import { invertMellin, mellinContour } from '../../src/physics/pdf/mellinInversion.js';
import { tabulateByMellinInversion } from '../../src/physics/pdf/mellinTabulation.js';
import { expectClose } from '../helpers.js';

describe('inverse Mellin transform on the bent contour', () => {
  it('recovers x f = x from F(N) = 1/N', () => {
    const contour = mellinContour({ c: 1.5, phi: 0.75 * Math.PI, zMax: 30, panels: 8, pointsPerPanel: 12, growth: 2 });
    // The pole at N = 0 lies behind the contour; at x = 1e-6 the factor x^(1-c) costs digits (1e-7).
    for (const [x, rel] of [[1e-6, 1e-6], [0.01, 1e-10], [0.3, 1e-10]] as const) {
      expectClose(invertMellin(contour, x, contour.points.map((n) => inverse(n))), x, { rel }, `x = ${x}`);
    }
  });

  it('the benchmark contours give back the toy input at mu0 (2e-9 relative up to x = 0.9, 1e-7 to x = 0.99)', () => {
    // At mu0 the evolution is the identity, so this checks the quadrature against the closed-form input (hep-ph/0204316).
    const xs = [1e-7, 3e-5, 0.004, 0.01, 0.2, 0.6, 0.75, 0.9, 0.95, 0.99];
    const values = lesHouchesXfDirect(xs, [Math.SQRT2]);
    for (let column = 0; column < 11; column++) {
      xs.forEach((x, ix) => {
        const expected = lesHouchesInputXf(column, x);
        if (expected === 0) expect(values[column]![ix]).toBe(0);
        else expectClose(values[column]![ix]!, expected, { rel: x <= 0.9 ? 2e-9 : 1e-7 }, `column ${column} at x = ${x}`);
      });
    }
  });

  it('the benchmark contours agree with much denser contours placed near each saddle point (1e-6)', () => {
    // Reference: 480 points, intercept c = max(1.6, 1 + 3/ln(1/x)) near the saddle of x^(-N) N^(-beta).
    const targets = [Math.log(1.4 ** 2), Math.log(5 ** 2), Math.log(1e4), Math.log(1e8)];
    for (const x of [1e-6, 0.05, 0.75, 0.95]) {
      const lnInverse = -Math.log(x);
      const reference = tabulateByMellinInversion(
        [{ xMax: x, shape: { c: Math.max(1.6, 1 + 3 / lnInverse), phi: 0.75 * Math.PI, zMax: Math.min(4000, 60 / lnInverse + (x > 0.3 ? 3000 : 0)), panels: 20, pointsPerPanel: 24, growth: 2 } }],
        [x],
        targets.length,
        (n) => evolveMoments(lesHouchesEvolutionSetup, n, targets),
      );
      const ours = tabulateByMellinInversion(LES_HOUCHES_CONTOUR_BANDS, [x], targets.length, (n) => evolveMoments(lesHouchesEvolutionSetup, n, targets));
      for (let column = 0; column < 11; column++) {
        for (let k = 0; k < targets.length; k++) {
          const r = reference[column]![k]!;
          if (r === 0) expect(ours[column]![k]).toBe(0);
          else expectClose(ours[column]![k]!, r, { rel: 1e-6 }, `column ${column} at x = ${x}, target ${k}`);
        }
      }
    }
  });

  it('rejects x outside the bands', () => {
    expect(() => tabulateByMellinInversion(LES_HOUCHES_CONTOUR_BANDS, [0.995], 1, () => new Float64Array(22))).toThrow(/x must be in \(0, 0.99\]/);
    expect(complex(1).im).toBe(0);
  });
});
