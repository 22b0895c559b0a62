import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../src/physics/random.js';
import { VegasGrid, VegasIntegrator } from '../../src/generator/vegas.js';
import { expectClose } from '../helpers.js';

/** A narrow Gaussian peak in each of 3 dimensions, normalised on the real line: the cube integral is erf(0.5/(sqrt 2 s))^3. */
const width = 0.03;
const peak = (x: Float64Array): number => {
  let f = 1;
  for (let d = 0; d < 3; d++) {
    const z = (x[d]! - 0.5) / width;
    f *= Math.exp(-0.5 * z * z) / (width * Math.sqrt(2 * Math.PI));
  }
  return f;
};
// erf(0.5 / (sqrt 2 * 0.03)) = erf(11.785) = 1 to double precision (Abramowitz and Stegun 7.1.13 bound: 1 - erf(z) < exp(-z^2)/(z sqrt pi)).
const exactPeak = 1;

describe('VEGAS (Lepage 1978)', () => {
  it('integrates a narrow 3-d Gaussian to its exact value within 3 standard errors, and adaptation shrinks the error', () => {
    const grid = new VegasGrid(3, 50);
    const vegas = new VegasIntegrator(peak, grid);
    const flat = new VegasIntegrator(peak, new VegasGrid(3, 50)).iterate(20000, RandomStream.forStream(7, 1), false);
    vegas.adapt(10, 20000, RandomStream.forStream(7, 2));
    const result = vegas.integrate({ callsPerIteration: 20000, targetRelativeError: 1e-3, maxIterations: 50 }, RandomStream.forStream(7, 3));
    expect(Math.abs(result.integral - exactPeak)).toBeLessThan(3 * result.error);
    expect(result.error / result.integral).toBeLessThan(1e-3 + 1e-12);
    // Without adaptation the relative error of 20000 points is about 30%; adapted, below 1e-2 per iteration.
    expect(flat.error / flat.estimate).toBeGreaterThan(0.1);
    expect(result.iterations[0]!.error / result.iterations[0]!.estimate).toBeLessThan(0.01);
    // chi^2/dof of frozen-grid iterations is about 1 (threshold: 3, a p-value far below 1e-3 for >= 2 dof).
    expect(result.chi2PerDof).toBeLessThan(3);
  });

  it('is exact for a product of one-dimensional functions it can learn: x^2 y^4 z on the unit cube = 1/30', () => {
    const f = (x: Float64Array) => x[0]! ** 2 * x[1]! ** 4 * x[2]!;
    const vegas = new VegasIntegrator(f, new VegasGrid(3));
    vegas.adapt(6, 10000, RandomStream.forStream(3, 1));
    const result = vegas.integrate({ callsPerIteration: 10000, targetRelativeError: 5e-4, maxIterations: 100 }, RandomStream.forStream(3, 2));
    expect(Math.abs(result.integral - 1 / 30)).toBeLessThan(3 * result.error);
  });

  it('gives the same grid and result for the same seed, and a different result for another seed', () => {
    const run = (seed: number) => {
      const vegas = new VegasIntegrator(peak, new VegasGrid(3));
      vegas.adapt(4, 5000, RandomStream.forStream(seed, 1));
      return { edges: Array.from(vegas.grid.edges), result: vegas.integrate({ callsPerIteration: 5000, targetRelativeError: 0, maxIterations: 3 }, RandomStream.forStream(seed, 2)).integral };
    };
    expect(run(11)).toEqual(run(11));
    expect(run(12).result).not.toBe(run(11).result);
  });

  it('starts uniform with unit Jacobian, and stays nearly uniform for a constant integrand', () => {
    const grid = new VegasGrid(2, 10);
    const x = new Float64Array(2);
    expectClose(grid.map(Float64Array.of(0.25, 0.75), x, new Int32Array(2)), 1, { rel: 1e-12 });
    expectClose(x[0]!, 0.25, { rel: 1e-12 });
    const vegas = new VegasIntegrator(() => 2, grid);
    vegas.adapt(3, 10000, RandomStream.forStream(1));
    // Only the Poisson noise of the points per bin moves the edges (about 1% of a bin for 1000 points per bin).
    for (let i = 0; i <= 10; i++) expectClose(grid.edges[i]!, i / 10, { abs: 0.005 });
  });

  it('refined edges stay ordered, span [0, 1], and concentrate where the function is large', () => {
    const grid = new VegasGrid(1, 20);
    const vegas = new VegasIntegrator((x) => Math.exp(-50 * x[0]!), grid);
    vegas.adapt(8, 4000, RandomStream.forStream(5));
    expect(grid.edges[0]).toBe(0);
    expect(grid.edges[20]).toBe(1);
    for (let i = 0; i < 20; i++) expect(grid.edges[i + 1]!).toBeGreaterThan(grid.edges[i]!);
    expect(grid.edges[10]!).toBeLessThan(0.1);
  });

  it('rejects bad grid sizes with a TamisError', () => {
    expect(() => new VegasGrid(0)).toThrow(/dimensions/);
    expect(() => new VegasGrid(2, 1)).toThrow(/bins/);
  });
});
