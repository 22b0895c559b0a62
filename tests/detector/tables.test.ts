import { describe, expect, it } from 'vitest';
import { DepositList } from '../../src/detector/depositList.js';
import { EfficiencyTable } from '../../src/detector/efficiencyTable.js';
import { EtaBinnedValues } from '../../src/detector/etaBinnedValues.js';
import { buildJets } from '../../src/detector/jetBuilding.js';
import { softTermWidth } from '../../src/detector/missingMomentum.js';
import { FLAVOUR_BOTTOM, FLAVOUR_LIGHT, KIND_ELECTRON, KIND_HADRON, KIND_INVISIBLE, KIND_PARTON, KIND_UNDECAYED, KIND_UNKNOWN, particleKind } from '../../src/detector/particleKinds.js';
import { ResolutionTable } from '../../src/detector/resolutionTable.js';
import { expectClose } from '../helpers.js';

describe('EfficiencyTable', () => {
  const table = new EfficiencyTable([10, 20, 50], [0, 1, 2.5], [
    [0.5, 0.4],
    [0.8, 0.7],
  ]);
  it('runs its doc example', () => {
    expect(new EfficiencyTable([10, 20], [0, 2.5], [[0.8]]).probability(15, 1)).toBe(0.8);
  });
  it('uses half-open bins [low, high) in pT and |eta|', () => {
    expect(table.probability(10, 0)).toBe(0.5);
    expect(table.probability(19.999, 0.999)).toBe(0.5);
    expect(table.probability(20, 1)).toBe(0.7);
    expect(table.probability(49.9, 2.49)).toBe(0.7);
  });
  it('is 0 below the first pT edge and outside the |eta| edges', () => {
    expect(table.probability(9.99, 0.1)).toBe(0);
    expect(table.probability(30, 2.5)).toBe(0);
    expect(table.probability(30, 3)).toBe(0);
    expect(table.probability(Number.NaN, 0)).toBe(0);
  });
  it('keeps the last pT row above the last pT edge (efficiency plateau)', () => {
    expect(table.probability(5000, 0.2)).toBe(0.8);
  });
  it('refuses rows that do not match its edges', () => {
    expect(() => new EfficiencyTable([10, 20, 50], [0, 2.5], [[0.5]])).toThrow(RangeError);
  });
});

describe('EtaBinnedValues', () => {
  it('runs its doc example and keeps the last bin beyond the last edge', () => {
    const flip = new EtaBinnedValues([0, 1.5, 2.5], [1e-4, 1e-2]);
    expect(flip.at(2)).toBe(0.01);
    expect(flip.at(0)).toBe(1e-4);
    expect(flip.at(1.5)).toBe(0.01);
    expect(flip.at(7)).toBe(0.01);
  });
});

describe('ResolutionTable', () => {
  it('runs its doc example: 100%/sqrt(E) is 10% at 100 GeV', () => {
    expect(new ResolutionTable([0, 5], { noise: [0], stochastic: [1], constant: [0], linear: [0] }).relativeWidth(100, 0)).toBe(0.1);
  });
  it('adds noise, stochastic, constant and linear terms in quadrature', () => {
    const table = new ResolutionTable([0, 1.5, 5], { noise: [3, 0], stochastic: [1, 0], constant: [0.05, 0.02], linear: [0, 1e-4] });
    // sqrt((3/100)^2 + 1/100 + 0.05^2) = sqrt(0.0009 + 0.01 + 0.0025), computed by hand
    expectClose(table.relativeWidth(100, 0.5), Math.sqrt(0.0134), { rel: 1e-12 });
    // sqrt(0.02^2 + (1e-4 * 1000)^2) = sqrt(0.0004 + 0.01)
    expectClose(table.relativeWidth(1000, 3), Math.sqrt(0.0104), { rel: 1e-12 });
    // beyond the last edge the last bin applies
    expectClose(table.relativeWidth(1000, 9), Math.sqrt(0.0104), { rel: 1e-12 });
  });
});

describe('softTermWidth', () => {
  it('runs its doc example', () => {
    expectClose(softTermWidth(6, 0.5, 64), Math.sqrt(52), { rel: 1e-15 });
  });
});

describe('particleKind', () => {
  it('sorts PDG ids into what the detector sees', () => {
    expect(particleKind(11)).toBe(KIND_ELECTRON);
    expect(particleKind(12)).toBe(KIND_INVISIBLE);
    expect(particleKind(5)).toBe(KIND_PARTON);
    expect(particleKind(21)).toBe(KIND_PARTON);
    expect(particleKind(211)).toBe(KIND_HADRON);
    expect(particleKind(20213)).toBe(KIND_HADRON);
    expect(particleKind(98)).toBe(KIND_HADRON); // the generator's lumped tau-decay hadrons
    expect(particleKind(15)).toBe(KIND_UNDECAYED);
    expect(particleKind(6)).toBe(KIND_UNDECAYED);
    expect(particleKind(1000022)).toBe(KIND_INVISIBLE);
    expect(particleKind(1000015)).toBe(KIND_UNKNOWN);
    expect(particleKind(0)).toBe(KIND_UNKNOWN);
  });
});

describe('buildJets', () => {
  const add = (list: DepositList, pt: number, eta: number, phi: number, flavour: number, id: number): void => {
    const pz = pt * Math.sinh(eta);
    list.add(pt * Math.cos(phi), pt * Math.sin(phi), pz, Math.hypot(pt, pz), pt, eta, phi, flavour, id);
  };
  it('merges a parton within the radius of a harder one, keeping the b flavour', () => {
    const deposits = new DepositList(2);
    const jets = new DepositList(2);
    add(deposits, 30, 0.1, 0.2, FLAVOUR_BOTTOM, 5);
    add(deposits, 80, 0.0, 0.0, FLAVOUR_LIGHT, 21);
    add(deposits, 50, 0.0, 3.0, FLAVOUR_LIGHT, 1);
    buildJets(deposits, 0.4, jets, new Int32Array(3));
    expect(jets.size).toBe(2);
    expect(jets.flavour[0]).toBe(FLAVOUR_BOTTOM);
    expect(jets.truthId[0]).toBe(5);
    expectClose(jets.px[0]!, 80 + 30 * Math.cos(0.2), { rel: 1e-12 });
    // the merged jet's pT is recomputed from the summed momentum
    expectClose(jets.pt[0]!, Math.hypot(80 + 30 * Math.cos(0.2), 30 * Math.sin(0.2)), { rel: 1e-12 });
    expect(jets.truthId[1]).toBe(1);
  });
  it('keeps partons apart across the phi = pi boundary only when they are farther than the radius', () => {
    const deposits = new DepositList(2);
    const jets = new DepositList(2);
    add(deposits, 60, 0, Math.PI - 0.1, FLAVOUR_LIGHT, 1);
    add(deposits, 40, 0, -Math.PI + 0.1, FLAVOUR_LIGHT, 2);
    buildJets(deposits, 0.4, jets, new Int32Array(2));
    expect(jets.size).toBe(1);
    buildJets(deposits, 0.15, jets, new Int32Array(2));
    expect(jets.size).toBe(2);
    buildJets(deposits, 0, jets, new Int32Array(2));
    expect(jets.size).toBe(2);
  });
});
