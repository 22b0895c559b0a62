/**
 * Minimal complex arithmetic for Mellin-space evolution. Values are small
 * immutable objects; the code that uses them runs a few thousand times per grid
 * build, so clarity is preferred over allocation-free tricks here (the hot
 * inverse-transform loop works on typed arrays instead).
 */

export interface Complex {
  readonly re: number;
  readonly im: number;
}

export function complex(re: number, im = 0): Complex {
  return { re, im };
}

export function add(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

export function sub(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

export function mul(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

export function scale(a: Complex, s: number): Complex {
  return { re: a.re * s, im: a.im * s };
}

export function addReal(a: Complex, s: number): Complex {
  return { re: a.re + s, im: a.im };
}

/** a / b (Smith's algorithm, robust against overflow). */
export function div(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

export function inverse(b: Complex): Complex {
  return div({ re: 1, im: 0 }, b);
}

export function exp(a: Complex): Complex {
  const m = Math.exp(a.re);
  return { re: m * Math.cos(a.im), im: m * Math.sin(a.im) };
}

/** Principal logarithm. */
export function log(a: Complex): Complex {
  return { re: Math.log(Math.hypot(a.re, a.im)), im: Math.atan2(a.im, a.re) };
}

/** Principal square root (branch cut on the negative real axis). */
export function sqrt(a: Complex): Complex {
  const r = Math.hypot(a.re, a.im);
  if (r === 0) return { re: 0, im: 0 };
  if (a.re >= 0) {
    const t = Math.sqrt((r + a.re) / 2);
    return { re: t, im: a.im / (2 * t) };
  }
  const t = Math.sqrt((r - a.re) / 2);
  return { re: Math.abs(a.im) / (2 * t), im: a.im >= 0 ? t : -t };
}

/**
 * Digamma function psi(z) for complex z away from the poles at 0, -1, -2, ...:
 * upward recurrence psi(z) = psi(z + 1) - 1/z until |z| >= 10, then the
 * asymptotic series psi(z) ~ ln z - 1/(2z) - sum_k B_2k / (2k z^2k)
 * (Abramowitz and Stegun 6.3.5 and 6.3.18), truncated after B_12: error about 1e-15 for |z| >= 10.
 */
export function digamma(z: Complex): Complex {
  let shift: Complex = { re: 0, im: 0 };
  let w = z;
  while (w.re * w.re + w.im * w.im < 100) {
    shift = add(shift, inverse(w));
    w = addReal(w, 1);
  }
  const inv = inverse(w);
  const inv2 = mul(inv, inv);
  // Horner in 1/z^2: 1/12 - 1/(120 z^2) + 1/(252 z^4) - 1/(240 z^6) + 1/(132 z^8) - 691/(32760 z^10), times 1/z^2.
  let series = addReal(scale(inv2, -691 / 32760), 1 / 132);
  series = addReal(mul(series, inv2), -1 / 240);
  series = addReal(mul(series, inv2), 1 / 252);
  series = addReal(mul(series, inv2), -1 / 120);
  series = addReal(mul(series, inv2), 1 / 12);
  series = mul(series, inv2);
  const result = sub(sub(log(w), scale(inv, 0.5)), series);
  return sub(result, shift);
}

/** Euler–Mascheroni constant (Abramowitz and Stegun 6.1.3). */
export const EULER_GAMMA = 0.5772156649015329;

/** Harmonic sum S_1(N) = psi(N + 1) + gamma_E, continued to complex N. */
export function harmonicS1(n: Complex): Complex {
  return addReal(digamma(addReal(n, 1)), EULER_GAMMA);
}
