import { describe, expect, it } from 'vitest';
import type { PartonDensity } from '../../src/physics/partonDensity.js';
import { integrateGaussLegendre } from '../../src/physics/pdf/gaussLegendre.js';
import { lesHouchesToyDensities } from '../../src/physics/pdf/lesHouchesGrid.js';
import { partonLuminosity } from '../../src/physics/pdf/luminosity.js';
import { expectClose } from '../helpers.js';

/** A density with a closed-form luminosity: f(x) = (1 - x) for every flavour (test fixture). */
const linearDensity: PartonDensity = {
  name: 'f(x) = 1 - x',
  xMin: 0,
  qMin: 1,
  qMax: 1e4,
  xfx: (_flavour, x) => (x > 0 && x < 1 ? x * (1 - x) : 0),
  xfxAll: () => undefined,
  alphaS: () => 0.1,
};

describe('parton luminosity dL_ab/dtau = integral_tau^1 dx/x f_a(x) f_b(tau/x)', () => {
  it('matches the closed form for f = 1 - x: -(1 + tau) ln tau - 2 (1 - tau)', () => {
    // integral_tau^1 dx/x (1 - x)(1 - tau/x), done by hand.
    for (const tau of [1e-4, 0.01, 0.3, 0.8]) {
      expectClose(partonLuminosity(linearDensity, 2, -2, tau, 100), -(1 + tau) * Math.log(tau) - 2 * (1 - tau), { rel: 1e-10 }, `tau = ${tau}`);
    }
  });

  it('is symmetric under a <-> b (substitute x -> tau/x)', () => {
    const pdf = lesHouchesToyDensities();
    for (const [a, b] of [[2, -1], [21, 2], [3, -4]] as const) {
      for (const tau of [1e-5, 1e-3, 0.05]) {
        expectClose(partonLuminosity(pdf, a, b, tau, 300), partonLuminosity(pdf, b, a, tau, 300), { rel: 1e-7 }, `${a} ${b} at tau = ${tau}`);
      }
    }
  });

  it('its Mellin moments factorise: integral dtau tau^(N-1) dL/dtau = F_a(N) F_b(N), N = 3', () => {
    // Mellin convolution theorem, checked against direct integration of each density on its
    // own: F(3) = integral x^2 f(x) dx. N = 3 keeps the part below tau = 1e-8 under 1e-9.
    const pdf = lesHouchesToyDensities();
    const q = 100;
    const moment = (flavour: number): number =>
      integrateGaussLegendre((y) => Math.exp(2 * y) * pdf.xfx(flavour, Math.exp(y), q), Math.log(1e-8), 0, 32, 16);
    for (const [a, b] of [[2, -2], [21, 1], [21, 21]] as const) {
      // tau^3 dL/dtau integrated in ln tau.
      const left = integrateGaussLegendre((y) => Math.exp(3 * y) * partonLuminosity(pdf, a, b, Math.exp(y), q), Math.log(1e-8), 0, 32, 16);
      expectClose(left, moment(a) * moment(b), { rel: 1e-6 }, `${a} ${b}`);
    }
  });

  it('is 0 for tau >= 1 and rejects tau <= 0', () => {
    expect(partonLuminosity(linearDensity, 1, 1, 1, 100)).toBe(0);
    expect(() => partonLuminosity(linearDensity, 1, 1, 0, 100)).toThrow(/tau must be > 0/);
  });
});
