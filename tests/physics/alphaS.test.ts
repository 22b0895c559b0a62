import { describe, expect, it } from 'vitest';
import {
  LES_HOUCHES_ALPHA_S_SETTINGS,
  MZ_NORMALISED_ALPHA_S_SETTINGS,
  OneLoopAlphaS,
  beta0,
  lesHouchesAlphaS,
  mzNormalisedAlphaS,
} from '../../src/physics/alphaS.js';
import { TamisError } from '../../src/errors.js';
import { expectClose } from '../helpers.js';

/**
 * Independent check of the closed form: integrates the one-loop equation
 * d a / d ln mu^2 = -beta0(nf) a^2 (a = alpha_s / 4 pi) with fourth-order Runge–Kutta,
 * range by range, from the reference to the target.
 */
function integrateRunning(settings: typeof LES_HOUCHES_ALPHA_S_SETTINGS, q: number): number {
  const [mc, mb, mt] = settings.thresholds;
  const edges = settings.maxFlavours === 6 ? [mc, mb, mt] : [mc, mb];
  const nfAt = (lnQ2: number): number => 3 + edges.filter((m) => lnQ2 >= Math.log(m * m) - 1e-15).length;
  let a = settings.referenceAlphaS / (4 * Math.PI);
  let ln = Math.log(settings.referenceScale ** 2);
  const target = Math.log(q * q);
  const stops = edges.map((m) => Math.log(m * m)).filter((e) => (e - ln) * (target - e) > 0);
  stops.sort((x, y) => (target > ln ? x - y : y - x));
  for (const end of [...stops, target]) {
    const nf = nfAt((ln + end) / 2);
    const steps = 2000;
    const h = (end - ln) / steps;
    const f = (y: number): number => -beta0(nf) * y * y;
    for (let i = 0; i < steps; i++) {
      const k1 = f(a);
      const k2 = f(a + 0.5 * h * k1);
      const k3 = f(a + 0.5 * h * k2);
      const k4 = f(a + h * k3);
      a += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    }
    ln = end;
  }
  return 4 * Math.PI * a;
}

describe('one-loop alpha_s', () => {
  it('beta0 = 11 - 2 nf / 3', () => {
    expect(beta0(4)).toBeCloseTo(25 / 3, 14);
    expect(beta0(5)).toBeCloseTo(23 / 3, 14);
  });

  it('benchmark coupling: alpha_s(mu0^2 = 2 GeV^2) = 0.35 and alpha_s(10^4 GeV^2) = 0.1223055', () => {
    // Les Houches benchmark settings (hep-ph/0204316, section 1.3); 0.1223055 is checks.md section 1 [C].
    expectClose(lesHouchesAlphaS.alphaSAtQ2(2), 0.35, { rel: 1e-14 });
    expectClose(lesHouchesAlphaS.alphaSAtQ2(1e4), 0.1223055, { rel: 1e-6 });
    expectClose(lesHouchesAlphaS.alphaS(100), 0.1223055, { rel: 1e-6 });
  });

  it('benchmark coupling has nf = 3 below m_c = sqrt 2, 4 up to m_b = 4.5 GeV, 5 above, also above m_t', () => {
    expect(lesHouchesAlphaS.activeFlavours(1.4)).toBe(3);
    expect(lesHouchesAlphaS.activeFlavours(2)).toBe(4);
    expect(lesHouchesAlphaS.activeFlavours(4.49)).toBe(4);
    expect(lesHouchesAlphaS.activeFlavours(4.5)).toBe(5);
    expect(lesHouchesAlphaS.activeFlavours(1000)).toBe(5);
  });

  it('M_Z-normalised coupling: alpha_s(M_Z) = 0.1180 (PDG 2024), nf = 6 above m_t = 172.57 GeV', () => {
    expectClose(mzNormalisedAlphaS.alphaS(91.188), 0.118, { rel: 1e-14 });
    expect(mzNormalisedAlphaS.activeFlavours(91.188)).toBe(5);
    expect(mzNormalisedAlphaS.activeFlavours(200)).toBe(6);
    expect(mzNormalisedAlphaS.activeFlavours(4)).toBe(4);
    expect(mzNormalisedAlphaS.activeFlavours(1.2)).toBe(3);
  });

  it('is continuous at every threshold (one-loop matching) and decreases with Q', () => {
    for (const coupling of [lesHouchesAlphaS, mzNormalisedAlphaS]) {
      for (const m of coupling.settings.thresholds.slice(0, coupling.settings.maxFlavours === 6 ? 3 : 2)) {
        expectClose(coupling.alphaS(m * (1 - 1e-12)), coupling.alphaS(m * (1 + 1e-12)), { rel: 1e-10 }, `threshold ${m}`);
      }
      let previous = Infinity;
      for (let q = 1.2; q < 2e4; q *= 1.3) {
        const value = coupling.alphaS(q);
        expect(value).toBeLessThan(previous);
        previous = value;
      }
    }
  });

  it('agrees with a Runge–Kutta integration of the renormalisation-group equation to 1e-10', () => {
    // The closed form 1/a = 1/a0 + beta0 ln(mu^2/mu0^2) is the exact solution of
    // da/d ln mu^2 = -beta0 a^2 (any QCD textbook); the integration checks the range bookkeeping.
    for (const settings of [LES_HOUCHES_ALPHA_S_SETTINGS, MZ_NORMALISED_ALPHA_S_SETTINGS]) {
      const coupling = new OneLoopAlphaS(settings);
      for (const q of [1.3, 1.45, 3, 4.6, 30, 91.188, 300, 5000]) {
        expectClose(coupling.alphaS(q), integrateRunning(settings, q), { rel: 1e-10 }, `Q = ${q}`);
      }
    }
  });

  it('throws a physics error below the Landau pole and rejects bad settings', () => {
    expect(() => lesHouchesAlphaS.alphaS(0.1)).toThrow(/Landau pole/);
    try {
      lesHouchesAlphaS.alphaS(0.1);
    } catch (error) {
      expect(error).toBeInstanceOf(TamisError);
      expect((error as TamisError).code).toBe('physics');
    }
    expect(() => new OneLoopAlphaS({ ...LES_HOUCHES_ALPHA_S_SETTINGS, thresholds: [5, 4.5, 175] })).toThrow(/thresholds/);
    expect(() => new OneLoopAlphaS({ ...LES_HOUCHES_ALPHA_S_SETTINGS, referenceAlphaS: -0.1 })).toThrow(/reference/);
  });
});
