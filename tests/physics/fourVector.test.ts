import { describe, expect, it } from 'vitest';
import {
  FourVector,
  boost,
  boostFromRestFrame,
  boostToRestFrame,
  deltaPhi,
  deltaR,
  eta,
  mass,
  mass2,
  pairMass,
  phi,
  pt,
  rapidity,
  rotateY,
  rotateZ,
  setPtEtaPhiM,
  setPxPyPzE,
  transverseMass,
} from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';
import { expectClose } from '../helpers.js';

describe('four-vectors', () => {
  it('FourVector.fromPxPyPzE(3, 4, 0, 13) has mass 12 and pT 5', () => {
    const v = FourVector.fromPxPyPzE(3, 4, 0, 13);
    expect(v.mass).toBe(12);
    expect(v.pt).toBe(5);
  });

  it('the same vector built from (px, py, pz, E) and from (pt, eta, phi, m) has one mass, pt, eta and phi', () => {
    const rng = RandomStream.forStream(1);
    for (let k = 0; k < 1000; k++) {
      const ptValue = 1 + 500 * rng.uniform();
      const etaValue = 8 * rng.uniform() - 4;
      const phiValue = 2 * Math.PI * rng.uniform() - Math.PI;
      const m = 200 * rng.uniform();
      const a = FourVector.fromPtEtaPhiM(ptValue, etaValue, phiValue, m);
      const b = FourVector.fromPxPyPzE(a.px, a.py, a.pz, a.e);
      expectClose(b.mass, m, { rel: 1e-9, abs: 1e-6 });
      expectClose(b.pt, ptValue, { rel: 1e-12 });
      expectClose(b.eta, etaValue, { rel: 1e-10, abs: 1e-12 });
      expectClose(b.phi, phiValue, { abs: 1e-12 });
    }
  });

  it('rapidity equals pseudorapidity for massless vectors', () => {
    const v = FourVector.fromPtEtaPhiM(30, 1.7, 0.2, 0);
    expectClose(v.rapidity, 1.7, { rel: 1e-12 });
  });

  it('keeps the mass invariant under boosts and rotations (property, fixed seed)', () => {
    const rng = RandomStream.forStream(2);
    const p = new Float64Array(4);
    for (let k = 0; k < 1000; k++) {
      const m = 0.1 + 300 * rng.uniform();
      setPtEtaPhiM(p, 0, 1000 * rng.uniform(), 10 * rng.uniform() - 5, 2 * Math.PI * rng.uniform() - Math.PI, m);
      const b = 0.999 * rng.uniform();
      const ct = 2 * rng.uniform() - 1;
      const st = Math.sqrt(1 - ct * ct);
      const ph = 2 * Math.PI * rng.uniform();
      boost(p, 0, b * st * Math.cos(ph), b * st * Math.sin(ph), b * ct);
      rotateZ(p, 0, 2 * Math.PI * rng.uniform());
      rotateY(p, 0, Math.PI * rng.uniform());
      // m^2 = E^2 - |p|^2 loses digits as E grows: compare m^2 to 1e-12 E^2 (rounding).
      expectClose(mass2(p, 0), m * m, { abs: 1e-12 * p[3]! * p[3]! });
    }
  });

  it('boost then inverse boost is the identity, conserving energy and momentum to 1e-9 relative', () => {
    const rng = RandomStream.forStream(3);
    const p = new Float64Array(4);
    for (let k = 0; k < 1000; k++) {
      setPxPyPzE(p, 0, 100 * rng.normal(), 100 * rng.normal(), 300 * rng.normal(), 0);
      p[3] = Math.hypot(p[0]!, p[1]!, p[2]!, 50 * rng.uniform());
      const original = Float64Array.from(p);
      const bx = 0.5 * (rng.uniform() - 0.5);
      const by = 0.5 * (rng.uniform() - 0.5);
      const bz = 0.9 * (rng.uniform() - 0.5);
      boost(p, 0, bx, by, bz);
      boost(p, 0, -bx, -by, -bz);
      const scale = original[3]!;
      for (let c = 0; c < 4; c++) expectClose(p[c]!, original[c]!, { abs: 1e-9 * scale });
    }
  });

  it('boosting into the rest frame of a vector gives (0, 0, 0, m), and back again restores it', () => {
    const p = new Float64Array(8);
    setPtEtaPhiM(p, 0, 120, 0.8, -2.1, 91.188);
    p.copyWithin(4, 0, 4);
    boostToRestFrame(p, 1, p, 0);
    expectClose(p[4]!, 0, { abs: 1e-9 });
    expectClose(p[5]!, 0, { abs: 1e-9 });
    expectClose(p[6]!, 0, { abs: 1e-9 });
    expectClose(p[7]!, 91.188, { rel: 1e-12 });
    boostFromRestFrame(p, 1, p, 0);
    for (let c = 0; c < 4; c++) expectClose(p[4 + c]!, p[c]!, { rel: 1e-11, abs: 1e-9 });
  });

  it('a pure boost along z shifts rapidity by atanh(beta) (kinematics fact)', () => {
    const p = new Float64Array(4);
    setPtEtaPhiM(p, 0, 40, 0.3, 1, 10);
    const y0 = rapidity(p, 0);
    boost(p, 0, 0, 0, 0.6);
    expectClose(rapidity(p, 0), y0 + Math.atanh(0.6), { rel: 1e-12 });
    expectClose(pt(p, 0), 40, { rel: 1e-12 });
  });

  it('deltaR(0, 0, 0.3, 0.4) is 0.5 and deltaPhi folds across +-pi', () => {
    expectClose(deltaR(0, 0, 0.3, 0.4), 0.5, { rel: 1e-15 });
    expectClose(deltaPhi(3.0, -3.0), 6.0 - 2 * Math.PI, { rel: 1e-12 });
    expectClose(deltaR(0, 3.1, 0, -3.1), 2 * Math.PI - 6.2, { rel: 1e-10 });
  });

  it('pairMass of two back-to-back massless 45.594 GeV vectors is 91.188 GeV', () => {
    const p = new Float64Array(8);
    setPxPyPzE(p, 0, 45.594, 0, 0, 45.594);
    setPxPyPzE(p, 1, -45.594, 0, 0, 45.594);
    expectClose(pairMass(p, 0, 1), 91.188, { rel: 1e-12 });
  });

  it('transverseMass(40, 0, 40, pi) is 80 (Jacobian edge of a W at rest)', () => {
    expectClose(transverseMass(40, 0, 40, Math.PI), 80, { rel: 1e-12 });
    expect(transverseMass(40, 1, 40, 1)).toBe(0);
  });

  it('eta is infinite along the beam and phi stays in (-pi, pi]', () => {
    const p = new Float64Array(4);
    setPxPyPzE(p, 0, 0, 0, 5, 5);
    expect(eta(p, 0)).toBe(Infinity);
    setPxPyPzE(p, 0, -1, -0, 0, 1);
    expect(phi(p, 0)).toBe(Math.PI);
  });

  it('refuses a boost at or above the speed of light', () => {
    const p = new Float64Array(4);
    setPxPyPzE(p, 0, 1, 0, 0, 2);
    expect(() => boost(p, 0, 1, 0, 0)).toThrow(/below 1/);
  });
});
