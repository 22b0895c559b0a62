/**
 * Inverse Mellin transform on a bent contour.
 *
 * x f(x) = 1/(2 pi i) integral_C dN x^(1-N) F(N), with C: N = c + z e^(+-i phi),
 * z in [0, inf), c right of every singularity of F. Since F(N*) = F(N)*, the two
 * branches combine into
 *
 *   x f(x) = (1/pi) integral_0^inf dz Im[ e^(i phi) x^(1-N(z)) F(N(z)) ]
 *
 * (the standard contour of Mellin-space evolution codes, e.g. A. Vogt,
 * Comput. Phys. Commun. 170 (2005) 65, hep-ph/0408244, section 3). With
 * phi > pi/2 the factor x^(-N) decays along the contour for x < 1. The z
 * integral is cut at z_max and done with Gauss–Legendre panels whose widths
 * grow geometrically away from the real axis, where the integrand varies fastest.
 */
import { type Complex } from './complex.js';
import { gaussLegendre } from './gaussLegendre.js';

/** Shape of a contour. */
export interface ContourShape {
  /** Intercept with the real axis (right of all singularities: 1.1 for the toy input). */
  readonly c: number;
  /** Angle of the upper branch to the real axis, in (pi/2, pi). */
  readonly phi: number;
  /** Upper end of z. */
  readonly zMax: number;
  /** Number of panels; panel k spans a width proportional to growth^k. */
  readonly panels: number;
  /** Ratio of the widths of neighbouring panels (> 1). */
  readonly growth: number;
  /** Gauss–Legendre points per panel. */
  readonly pointsPerPanel: number;
}

/** Quadrature points N_j on the contour and factors w_j e^(i phi) / pi. */
export interface MellinContour {
  readonly shape: ContourShape;
  readonly points: readonly Complex[];
  readonly factors: readonly Complex[];
}

/** Builds the quadrature points and factors of a contour. */
export function mellinContour(shape: ContourShape): MellinContour {
  const { nodes, weights } = gaussLegendre(shape.pointsPerPanel);
  const g = shape.growth;
  const unit = (shape.zMax * (g - 1)) / (g ** shape.panels - 1);
  const cosPhi = Math.cos(shape.phi);
  const sinPhi = Math.sin(shape.phi);
  const points: Complex[] = [];
  const factors: Complex[] = [];
  for (let panel = 0; panel < shape.panels; panel++) {
    const start = (unit * (g ** panel - 1)) / (g - 1);
    const half = 0.5 * unit * g ** panel;
    for (let i = 0; i < nodes.length; i++) {
      const z = start + half * (1 + nodes[i]!);
      const w = (half * weights[i]!) / Math.PI;
      points.push({ re: shape.c + z * cosPhi, im: z * sinPhi });
      factors.push({ re: w * cosPhi, im: w * sinPhi });
    }
  }
  return { shape, points, factors };
}

/**
 * x f(x) from the moments F(N_j) at the contour points.
 *
 * @example
 * // F(N) = 1 / N is the moment of f = 1, so x f(x) = x:
 * const contour = mellinContour({ c: 1.5, phi: 0.75 * Math.PI, zMax: 30, panels: 8, pointsPerPanel: 12, growth: 2 });
 * invertMellin(contour, 0.3, contour.points.map((n) => inverse(n))) // 0.3 (to 1e-12)
 */
export function invertMellin(contour: MellinContour, x: number, moments: readonly Complex[]): number {
  const factors = inversionFactors(contour, [x]);
  let sum = 0;
  for (let j = 0; j < moments.length; j++) sum += factors[2 * j]! * moments[j]!.im + factors[2 * j + 1]! * moments[j]!.re;
  return sum;
}

/**
 * The complex factors K_j(x) = w_j e^(i phi) x^(1-N_j) / pi for several x, as
 * interleaved (re, im) pairs in one array: [(i * points + j) * 2]. Then
 * x_i f(x_i) = sum_j Im(K_ij F_j) = sum_j (Kr F_im + Ki F_re): the hot loop of a grid build.
 */
export function inversionFactors(contour: MellinContour, xs: ArrayLike<number>): Float64Array {
  const count = contour.points.length;
  const out = new Float64Array(xs.length * count * 2);
  for (let i = 0; i < xs.length; i++) {
    const lnX = Math.log(xs[i]!);
    for (let j = 0; j < count; j++) {
      const n = contour.points[j]!;
      const magnitude = Math.exp((1 - n.re) * lnX);
      const phase = -n.im * lnX;
      const pr = magnitude * Math.cos(phase);
      const pi = magnitude * Math.sin(phase);
      const f = contour.factors[j]!;
      out[(i * count + j) * 2] = f.re * pr - f.im * pi;
      out[(i * count + j) * 2 + 1] = f.re * pi + f.im * pr;
    }
  }
  return out;
}
