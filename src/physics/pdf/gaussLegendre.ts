/**
 * Gauss–Legendre quadrature nodes and weights on [-1, 1], by Newton's method on
 * the Legendre polynomial P_n with the three-term recurrence (Abramowitz and
 * Stegun 25.4.29 and 22.7.10; the algorithm is common practice).
 */

export interface QuadratureRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

const cache = new Map<number, QuadratureRule>();

/**
 * The n-point Gauss–Legendre rule on [-1, 1] (exact for polynomials of degree 2n - 1).
 *
 * @example
 * gaussLegendre(2).nodes // [-0.5773502691896257, 0.5773502691896257]
 */
export function gaussLegendre(n: number): QuadratureRule {
  const known = cache.get(n);
  if (known !== undefined) return known;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    // Tricomi's initial guess, then Newton on P_n.
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 1;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      derivative = (n * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-15) break;
    }
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    const w = 2 / ((1 - x * x) * derivative * derivative);
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}

/**
 * Integral of f over [a, b] with `panels` equal panels of an n-point rule.
 *
 * @example
 * integrateGaussLegendre((x) => x * x, 0, 3) // 9 (to rounding)
 */
export function integrateGaussLegendre(f: (x: number) => number, a: number, b: number, panels = 1, n = 16): number {
  const { nodes, weights } = gaussLegendre(n);
  const width = (b - a) / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * width;
    for (let i = 0; i < n; i++) sum += weights[i]! * f(mid + 0.5 * width * nodes[i]!);
  }
  return 0.5 * width * sum;
}
