/**
 * Analysis-level objects: the reconstructed candidates an analysis keeps
 * after its own kinematic thresholds, lepton isolation and overlap removal.
 *
 * Order of operations (documented in analyses/README.md):
 *  1. thresholds: pT >= min_pt and |eta| <= max_abs_eta per kind;
 *  2. isolation of electrons and muons: the relative isolation
 *     I = (sum of pT of every other reconstructed candidate within Delta R <
 *     isolation_cone) / pT(lepton) must not exceed the kind's
 *     max_relative_isolation (candidates of all kinds, before thresholds,
 *     stand in for the tracks and calorimeter deposits of a real detector);
 *  3. overlap removal by Delta R, in this fixed order (common practice),
 *     each step using the objects that survived the previous ones:
 *     a. taus near a light lepton, b. jets near a light lepton,
 *     c. jets near a tau, d. light leptons near a remaining jet.
 *     A cone of 0 switches a step off.
 *  4. b-jets are the kept jets that carry the detector's b-tag and pass the
 *     b-jet thresholds.
 *
 * Everything lives in preallocated typed arrays that are refilled per event.
 */
import type { ObjectList, RecoEvent } from '../detector/recoEvent.js';
import { deltaR } from '../physics/fourVector.js';

export interface KinematicThresholds {
  /** Minimum transverse momentum, GeV. */
  minPt: number;
  /** Maximum |pseudorapidity|. */
  maxAbsEta: number;
}

export interface LeptonDefinition extends KinematicThresholds {
  /** Maximum relative isolation; Infinity switches isolation off. */
  maxRelativeIsolation: number;
}

/** Delta R cones of the overlap-removal steps (0 switches a step off). */
export interface OverlapRemoval {
  tausNearLeptons: number;
  jetsNearLeptons: number;
  jetsNearTaus: number;
  leptonsNearJets: number;
}

/** Object definitions of one analysis, defaults filled in. */
export interface ObjectDefinitions {
  electrons: LeptonDefinition;
  muons: LeptonDefinition;
  taus: KinematicThresholds;
  jets: KinematicThresholds;
  bJets: KinematicThresholds;
  /** Delta R cone of the lepton isolation sum. */
  isolationCone: number;
  overlapRemoval: OverlapRemoval;
}

/** A kind of selected object in flat arrays, sorted by decreasing pT. */
export class SelectedObjects {
  size = 0;
  pt = new Float64Array(8);
  eta = new Float64Array(8);
  phi = new Float64Array(8);
  charge = new Int8Array(8);
  /** Leptons: 11 or 13 (|PDG id|); jets: 1 when b-tagged. */
  label = new Uint8Array(8);
  /** Four-momenta (px, py, pz, E), GeV. */
  momentum = new Float64Array(32);

  /** Appends object `i` of `list`, keeping the pT order. */
  insert(list: ObjectList, i: number, label: number): void {
    if (this.size === this.pt.length) this.grow();
    const pt = list.pt[i]!;
    let j = this.size++;
    for (; j > 0 && this.pt[j - 1]! < pt; j--) this.move(j - 1, j);
    this.pt[j] = pt;
    this.eta[j] = list.eta[i]!;
    this.phi[j] = list.phi[i]!;
    this.charge[j] = list.charge[i]!;
    this.label[j] = label;
    const o = 4 * j;
    const p = 4 * i;
    this.momentum[o] = list.momentum[p]!;
    this.momentum[o + 1] = list.momentum[p + 1]!;
    this.momentum[o + 2] = list.momentum[p + 2]!;
    this.momentum[o + 3] = list.momentum[p + 3]!;
  }

  private move(from: number, to: number): void {
    this.pt[to] = this.pt[from]!;
    this.eta[to] = this.eta[from]!;
    this.phi[to] = this.phi[from]!;
    this.charge[to] = this.charge[from]!;
    this.label[to] = this.label[from]!;
    this.momentum.copyWithin(4 * to, 4 * from, 4 * from + 4);
  }

  private grow(): void {
    const n = 2 * this.pt.length;
    const widen = <T extends Float64Array | Int8Array | Uint8Array>(a: T, size: number): T => {
      const b = new (a.constructor as new (n: number) => T)(size);
      b.set(a);
      return b;
    };
    this.pt = widen(this.pt, n);
    this.eta = widen(this.eta, n);
    this.phi = widen(this.phi, n);
    this.charge = widen(this.charge, n);
    this.label = widen(this.label, n);
    this.momentum = widen(this.momentum, 4 * n);
  }
}

/** Keep-flags for one input list, grown on demand (never per event in steady state). */
class Flags {
  keep = new Uint8Array(16);
  reset(size: number): Uint8Array {
    if (this.keep.length < size) this.keep = new Uint8Array(2 * size);
    return this.keep;
  }
}

function passThresholds(list: ObjectList, i: number, cuts: KinematicThresholds): boolean {
  return list.pt[i]! >= cuts.minPt && Math.abs(list.eta[i]!) <= cuts.maxAbsEta;
}

/** Whether object `i` of `list` lies within `cone` of any kept object of `others`. */
function nearKept(list: ObjectList, i: number, others: ObjectList, keep: Uint8Array, cone: number): boolean {
  const eta = list.eta[i]!;
  const phi = list.phi[i]!;
  for (let j = 0; j < others.size; j++) {
    if (keep[j] === 1 && deltaR(eta, phi, others.eta[j]!, others.phi[j]!) < cone) return true;
  }
  return false;
}

/** Sum of pT of the objects of `others` within `cone` of object `i` of `list` (skipping `i` itself when the lists are one). */
function coneSum(list: ObjectList, i: number, others: ObjectList, cone: number): number {
  const eta = list.eta[i]!;
  const phi = list.phi[i]!;
  let sum = 0;
  for (let j = 0; j < others.size; j++) {
    if (others === list && j === i) continue;
    if (deltaR(eta, phi, others.eta[j]!, others.phi[j]!) < cone) sum += others.pt[j]!;
  }
  return sum;
}

/** The objects one set of definitions selects from each event, plus caches of derived quantities. */
export class AnalysisObjects {
  readonly definitions: ObjectDefinitions;
  /** Electrons and muons together, sorted by pT; `label` is 11 or 13. */
  readonly leptons = new SelectedObjects();
  readonly taus = new SelectedObjects();
  /** Jets (b-tagged or not); `label` is 1 for b-jets. */
  readonly jets = new SelectedObjects();
  nElectrons = 0;
  nMuons = 0;
  nBJets = 0;
  metX = 0;
  metY = 0;
  met = 0;
  metPhi = 0;
  weight = 1;

  /** Derived-quantity caches, filled on first use per event (see pairs.ts). */
  zSearched = false;
  zMass = 0;
  zFirst = -1;
  zSecond = -1;

  private readonly electronFlags = new Flags();
  private readonly muonFlags = new Flags();
  private readonly tauFlags = new Flags();
  private readonly jetFlags = new Flags();

  constructor(definitions: ObjectDefinitions) {
    this.definitions = definitions;
  }

  /** Selects this analysis's objects from a reconstructed event. */
  build(event: RecoEvent): void {
    const d = this.definitions;
    const { electrons, muons, taus, jets } = event;
    const ke = this.electronFlags.reset(electrons.size);
    const km = this.muonFlags.reset(muons.size);
    const kt = this.tauFlags.reset(taus.size);
    const kj = this.jetFlags.reset(jets.size);
    for (let i = 0; i < electrons.size; i++) ke[i] = passThresholds(electrons, i, d.electrons) && this.isolated(event, electrons, i, d.electrons) ? 1 : 0;
    for (let i = 0; i < muons.size; i++) km[i] = passThresholds(muons, i, d.muons) && this.isolated(event, muons, i, d.muons) ? 1 : 0;
    for (let i = 0; i < taus.size; i++) kt[i] = passThresholds(taus, i, d.taus) ? 1 : 0;
    for (let i = 0; i < jets.size; i++) kj[i] = passThresholds(jets, i, d.jets) ? 1 : 0;

    const or = d.overlapRemoval;
    if (or.tausNearLeptons > 0) {
      for (let i = 0; i < taus.size; i++) {
        if (kt[i] === 1 && (nearKept(taus, i, electrons, ke, or.tausNearLeptons) || nearKept(taus, i, muons, km, or.tausNearLeptons))) kt[i] = 0;
      }
    }
    if (or.jetsNearLeptons > 0) {
      for (let i = 0; i < jets.size; i++) {
        if (kj[i] === 1 && (nearKept(jets, i, electrons, ke, or.jetsNearLeptons) || nearKept(jets, i, muons, km, or.jetsNearLeptons))) kj[i] = 0;
      }
    }
    if (or.jetsNearTaus > 0) {
      for (let i = 0; i < jets.size; i++) if (kj[i] === 1 && nearKept(jets, i, taus, kt, or.jetsNearTaus)) kj[i] = 0;
    }
    if (or.leptonsNearJets > 0) {
      for (let i = 0; i < electrons.size; i++) if (ke[i] === 1 && nearKept(electrons, i, jets, kj, or.leptonsNearJets)) ke[i] = 0;
      for (let i = 0; i < muons.size; i++) if (km[i] === 1 && nearKept(muons, i, jets, kj, or.leptonsNearJets)) km[i] = 0;
    }

    const leptons = this.leptons;
    leptons.size = 0;
    this.nElectrons = 0;
    this.nMuons = 0;
    for (let i = 0; i < electrons.size; i++) {
      if (ke[i] === 1) {
        leptons.insert(electrons, i, 11);
        this.nElectrons++;
      }
    }
    for (let i = 0; i < muons.size; i++) {
      if (km[i] === 1) {
        leptons.insert(muons, i, 13);
        this.nMuons++;
      }
    }
    this.taus.size = 0;
    for (let i = 0; i < taus.size; i++) if (kt[i] === 1) this.taus.insert(taus, i, 15);
    this.jets.size = 0;
    this.nBJets = 0;
    for (let i = 0; i < jets.size; i++) {
      if (kj[i] !== 1) continue;
      const b = jets.tag[i] === 1 && passThresholds(jets, i, d.bJets) ? 1 : 0;
      this.jets.insert(jets, i, b);
      this.nBJets += b;
    }
    this.metX = event.metX;
    this.metY = event.metY;
    this.met = Math.hypot(event.metX, event.metY);
    this.metPhi = this.met > 0 ? Math.atan2(event.metY, event.metX) : 0;
    this.weight = event.weight;
    this.zSearched = false;
  }

  private isolated(event: RecoEvent, list: ObjectList, i: number, cuts: LeptonDefinition): boolean {
    if (cuts.maxRelativeIsolation === Infinity) return true;
    const cone = this.definitions.isolationCone;
    const sum = coneSum(list, i, event.electrons, cone) + coneSum(list, i, event.muons, cone) + coneSum(list, i, event.taus, cone) + coneSum(list, i, event.jets, cone);
    return sum <= cuts.maxRelativeIsolation * list.pt[i]!;
  }
}
