/**
 * Test-only parton densities: the Les Houches benchmark toy input at
 * mu0^2 = 2 GeV^2 (checks.md section 1; Giele et al., hep-ph/0204316, section 1.3),
 * with no evolution (the scale argument is ignored). Good enough to exercise
 * the hadronic integration; not physics.
 */
import type { PartonDensity } from '../../src/physics/partonDensity.js';

function dbar(x: number): number {
  return 0.1939875 * x ** -0.1 * (1 - x) ** 6;
}

/** x f(x) of the toy input for flavour -6..6 (0 or 21 = gluon). */
export function toyXf(flavour: number, x: number): number {
  if (!(x > 0 && x < 1)) return 0;
  const xdbar = dbar(x);
  const xubar = (1 - x) * xdbar;
  switch (flavour) {
    case 0:
    case 21:
      return 1.7 * x ** -0.1 * (1 - x) ** 5;
    case 1:
      return 3.06432 * x ** 0.8 * (1 - x) ** 4 + xdbar;
    case 2:
      return 5.1072 * x ** 0.8 * (1 - x) ** 3 + xubar;
    case -1:
      return xdbar;
    case -2:
      return xubar;
    case 3:
    case -3:
      return 0.2 * (xubar + xdbar);
    default:
      return 0;
  }
}

export const toyDensity: PartonDensity = {
  name: 'test-only toy input (no evolution)',
  xfx: (flavour, x) => toyXf(flavour, x),
  xfxAll(x, _q, out) {
    for (let f = -6; f <= 6; f++) out[f + 6] = toyXf(f === 0 ? 0 : f, x);
  },
  alphaS: () => 0.118,
  xMin: 1e-7,
  qMin: 1,
  qMax: 1e5,
};
