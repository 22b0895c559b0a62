import { describe, expect, it } from 'vitest';
import { lesHouchesAlphaS, beta0 } from '../../src/physics/alphaS.js';
import { complex, digamma, EULER_GAMMA, harmonicS1, type Complex } from '../../src/physics/pdf/complex.js';
import { integrateGaussLegendre } from '../../src/physics/pdf/gaussLegendre.js';
import { LES_HOUCHES_INPUT, lesHouchesInputMoment, lesHouchesInputXf, powerTermMoment } from '../../src/physics/pdf/lesHouchesInput.js';
import { lesHouchesEvolutionSetup } from '../../src/physics/pdf/lesHouchesEvolution.js';
import { evolveMoments, MOMENT_VECTOR_LENGTH } from '../../src/physics/pdf/mellinEvolution.js';
import { C_F, loSplittingMoments } from '../../src/physics/pdf/splittingMoments.js';
import { expectClose } from '../helpers.js';

// Columns: g d u s c b dbar ubar sbar cbar bbar
const G = 0, D = 1, U = 2, DBAR = 6, UBAR = 7;

const SCALES_GEV = [1.4, 2, 4.5, 10, 100, 1000, 10000];

function momentsAt(n: Complex, q: number): Float64Array {
  return evolveMoments(lesHouchesEvolutionSetup, n, [Math.log(q * q)]);
}
const re = (m: Float64Array, column: number): number => m[2 * column]!;

describe('complex special functions', () => {
  it('digamma: psi(1) = -gamma_E, psi(1/2) = -gamma_E - 2 ln 2 (Abramowitz and Stegun 6.3.2, 6.3.3)', () => {
    expectClose(digamma(complex(1)).re, -EULER_GAMMA, { abs: 2e-15 });
    expectClose(digamma(complex(0.5)).re, -EULER_GAMMA - 2 * Math.LN2, { abs: 2e-15 });
  });

  it('digamma: Im psi(1 + iy) = -1/(2y) + (pi/2) coth(pi y) (Abramowitz and Stegun 6.3.13)', () => {
    for (const y of [0.3, 1, 2.5, 17]) {
      const expected = -1 / (2 * y) + (Math.PI / 2) / Math.tanh(Math.PI * y);
      expectClose(digamma(complex(1, y)).im, expected, { rel: 1e-13 }, `y = ${y}`);
    }
  });

  it('digamma obeys psi(z + 1) = psi(z) + 1/z at complex z (A&S 6.3.5)', () => {
    for (const z of [complex(0.7, 3.1), complex(-2.5, 0.4), complex(12, -40)]) {
      const left = digamma({ re: z.re + 1, im: z.im });
      const right = digamma(z);
      const d = z.re * z.re + z.im * z.im;
      expectClose(left.re, right.re + z.re / d, { abs: 1e-13 });
      expectClose(left.im, right.im - z.im / d, { abs: 1e-13 });
    }
  });

  it('S_1(N) is the harmonic sum at integer N', () => {
    expectClose(harmonicS1(complex(4)).re, 1 + 1 / 2 + 1 / 3 + 1 / 4, { rel: 1e-14 });
  });
});

describe('input moments of the benchmark toy densities', () => {
  it('the Beta-function moments match x-space Gauss–Legendre integration', () => {
    // integral_0^1 x^(N-2) (x f) dx at real N, where the integrand is smooth after x = u^4.
    for (const [column, terms] of LES_HOUCHES_INPUT.entries()) {
      if (terms.length === 0) continue;
      for (const n of [2, 3.5]) {
        const numeric = integrateGaussLegendre((u) => 4 * u ** 3 * (u ** 4) ** (n - 2) * lesHouchesInputXf(column, u ** 4), 0, 1, 8, 24);
        expectClose(lesHouchesInputMoment(column, complex(n)).re, numeric, { rel: 1e-12 }, `column ${column}, N = ${n}`);
      }
    }
  });

  it('a complex moment is the conjugate at conjugate N', () => {
    const term = LES_HOUCHES_INPUT[G]![0]!;
    const a = powerTermMoment(term, complex(1.8, 2.2));
    const b = powerTermMoment(term, complex(1.8, -2.2));
    expectClose(a.re, b.re, { rel: 1e-15 });
    expectClose(a.im, -b.im, { rel: 1e-15 });
  });
});

describe('exact LO evolution in Mellin space (checks.md section 1, [C])', () => {
  it('momentum sum: the N = 2 moments add up to 1 - 2.2e-8 at every scale', () => {
    // P_qq(2) + P_gq(2) = 0 and P_qg(2) + P_gg(2) = 0 at LO: momentum is conserved exactly.
    for (const q of SCALES_GEV) {
      const m = momentsAt(complex(2), q);
      let sum = 0;
      for (let c = 0; c < MOMENT_VECTOR_LENGTH / 2; c++) sum += re(m, c);
      expectClose(sum, 1 - 2.2e-8, { abs: 1e-9 }, `Q = ${q}`);
    }
  });

  it('the non-singlet anomalous dimension vanishes at N = 1 (quark-number conservation)', () => {
    // The valence sums themselves are checked in x space (pdfGrid.test.ts): at N = 1 the
    // singlet moments diverge (P_gg and P_gq have a pole there), so the full vector is not finite.
    expectClose(loSplittingMoments(complex(1), 4).qq.re, 0, { abs: 1e-14 });
  });

  it('non-singlet moments scale as exp(-gamma_ns(N) R), R = ln(a/a0)/beta0, piecewise in nf', () => {
    // gamma_ns(N) = C_F (3 + 2/(N(N+1)) - 4 S_1(N)) (checks.md section 1); nf = 4 up to
    // m_b^2 = 20.25 GeV^2 and 5 above, so the exponent adds R_4 + R_5 with each range's beta0.
    const aOf = (q2: number): number => lesHouchesAlphaS.alphaSAtQ2(q2);
    for (const n of [2, 3, 4.5]) {
      const s1 = harmonicS1(complex(n)).re;
      const gamma = C_F * (3 + 2 / (n * (n + 1)) - 4 * s1);
      const start = momentsAt(complex(n), Math.SQRT2);
      const valenceDifference = (m: Float64Array): number => re(m, U) - re(m, UBAR) - (re(m, D) - re(m, DBAR));
      for (const q2 of [10, 20.25, 1e4, 1e7]) {
        const r4 = Math.log(aOf(Math.min(q2, 20.25)) / aOf(2)) / beta0(4);
        const r5 = q2 > 20.25 ? Math.log(aOf(q2) / aOf(20.25)) / beta0(5) : 0;
        const expected = valenceDifference(start) * Math.exp(-gamma * (r4 + r5));
        expectClose(valenceDifference(momentsAt(complex(n), Math.sqrt(q2))), expected, { rel: 1e-12 }, `N = ${n}, Q^2 = ${q2}`);
      }
    }
  });

  it('the N = 2 splitting moments conserve momentum (P_qq + P_gq = 0, P_qg + P_gg = 0)', () => {
    for (const nf of [3, 4, 5]) {
      const p = loSplittingMoments(complex(2), nf);
      expectClose(p.qq.re + p.gq.re, 0, { abs: 1e-12 });
      expectClose(p.qg.re + p.gg.re, 0, { abs: 1e-12 });
    }
  });

  it('the b quark is zero up to m_b = 4.5 GeV and the charm quark below mu0; s = sbar, c = cbar, b = bbar', () => {
    const n = complex(2.3, 1.7);
    const at = (q: number): Float64Array => momentsAt(n, q);
    expect(at(4.5)[2 * 5]).toBe(0);
    expect(at(4.5)[2 * 10]).toBe(0);
    expect(at(1.4)[2 * 4]).toBe(0);
    const high = at(300);
    for (const [quark, antiquark] of [[3, 8], [4, 9], [5, 10]] as const) {
      expectClose(high[2 * quark]!, high[2 * antiquark]!, { rel: 1e-13 });
      expectClose(high[2 * quark + 1]!, high[2 * antiquark + 1]!, { rel: 1e-13 });
    }
    expect(momentsAt(complex(2), 300)[2 * 5]).toBeGreaterThan(0);
  });
});
