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
import {
  CONE_JETS_NEAR_LEPTONS,
  CONE_JETS_NEAR_TAUS,
  CONE_LEPTONS_NEAR_JETS,
  CONE_TAUS_NEAR_LEPTONS,
  markThresholds,
  removeNear,
} from './objectGeometry.js';
import { IsolationSums } from './isolationSums.js';
import { Flags, SelectedObjects } from './selectedObjects.js';

export { SelectedObjects } from './selectedObjects.js';

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

/**
 * The objects one set of definitions selects from each event, plus caches of
 * derived quantities. Leptons and taus are copied (pair masses need their
 * momenta); jets are summarised (count, b-jet count, HT, leading pT), which is
 * all the variables use and keeps the per-event work small.
 */
export class AnalysisObjects {
  readonly definitions: ObjectDefinitions;
  /** Electrons and muons together, sorted by pT; `label` is 11 or 13. */
  readonly leptons = new SelectedObjects();
  readonly taus = new SelectedObjects();
  nElectrons = 0;
  nMuons = 0;
  nJets = 0;
  nBJets = 0;
  /** Scalar sum of the selected jets' pT, GeV. */
  ht = 0;
  /** pT of the leading selected jet (0 without jets), GeV. */
  leadingJetPt = 0;
  metX = 0;
  metY = 0;
  /** Missing transverse momentum magnitude, GeV. */
  met = 0;
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
  private readonly isolationOn: boolean;
  /** Squared Delta R cones of overlap removal, indexed by the CONE_* constants of objectGeometry.ts. */
  private readonly cones: Float64Array;
  /** Isolation cone sums of the event's leptons; shared with other analyses when `ownsIsolation` is false. */
  private readonly isolation: IsolationSums;
  private readonly ownsIsolation: boolean;

  /**
   * @param sharedIsolation isolation sums for `definitions.isolationCone` that the
   *   caller fills once per event before `build` (the selection engine shares
   *   them between analyses); without it, `build` fills its own.
   */
  constructor(definitions: ObjectDefinitions, sharedIsolation?: IsolationSums) {
    this.definitions = definitions;
    const or = definitions.overlapRemoval;
    this.cones = Float64Array.from([or.tausNearLeptons, or.jetsNearLeptons, or.jetsNearTaus, or.leptonsNearJets], (c) => c * c);
    this.isolationOn = definitions.electrons.maxRelativeIsolation !== Infinity || definitions.muons.maxRelativeIsolation !== Infinity;
    this.ownsIsolation = sharedIsolation === undefined;
    this.isolation = sharedIsolation ?? new IsolationSums(definitions.isolationCone);
  }

  /** Selects this analysis's objects from a reconstructed event. */
  build(event: RecoEvent): void {
    const d = this.definitions;
    const { electrons, muons, taus, jets } = event;
    const ke = this.electronFlags.reset(electrons.size);
    const km = this.muonFlags.reset(muons.size);
    const kt = this.tauFlags.reset(taus.size);
    const kj = this.jetFlags.reset(jets.size);
    let nLight = markThresholds(electrons, d.electrons, ke) + markThresholds(muons, d.muons, km);
    let nTaus = markThresholds(taus, d.taus, kt);
    let nJets = markThresholds(jets, d.jets, kj);
    if (this.isolationOn && nLight > 0) {
      if (this.ownsIsolation) this.isolation.compute(event);
      nLight = applyIsolation(electrons, ke, this.isolation.electrons, d.electrons) + applyIsolation(muons, km, this.isolation.muons, d.muons);
    }

    const or = d.overlapRemoval;
    const cones = this.cones;
    if (nTaus > 0 && nLight > 0 && or.tausNearLeptons > 0) {
      removeNear(taus, kt, electrons, ke, cones, CONE_TAUS_NEAR_LEPTONS);
      nTaus = removeNear(taus, kt, muons, km, cones, CONE_TAUS_NEAR_LEPTONS);
    }
    if (nJets > 0 && nLight > 0 && or.jetsNearLeptons > 0) {
      removeNear(jets, kj, electrons, ke, cones, CONE_JETS_NEAR_LEPTONS);
      nJets = removeNear(jets, kj, muons, km, cones, CONE_JETS_NEAR_LEPTONS);
    }
    if (nJets > 0 && nTaus > 0 && or.jetsNearTaus > 0) nJets = removeNear(jets, kj, taus, kt, cones, CONE_JETS_NEAR_TAUS);
    if (nLight > 0 && nJets > 0 && or.leptonsNearJets > 0) {
      removeNear(electrons, ke, jets, kj, cones, CONE_LEPTONS_NEAR_JETS);
      removeNear(muons, km, jets, kj, cones, CONE_LEPTONS_NEAR_JETS);
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
    this.summariseJets(jets, kj);
    this.metX = event.metX;
    this.metY = event.metY;
    this.met = Math.sqrt(event.metX * event.metX + event.metY * event.metY);
    this.weight = event.weight;
    this.zSearched = false;
  }

  private summariseJets(jets: ObjectList, keep: Uint8Array): void {
    const b = this.definitions.bJets;
    let n = 0;
    let nB = 0;
    let ht = 0;
    let leading = 0;
    for (let i = 0; i < jets.size; i++) {
      if (keep[i] !== 1) continue;
      const pt = jets.pt[i]!;
      n++;
      ht += pt;
      if (pt > leading) leading = pt;
      if (jets.tag[i] === 1 && pt >= b.minPt && Math.abs(jets.eta[i]!) <= b.maxAbsEta) nB++;
    }
    this.nJets = n;
    this.nBJets = nB;
    this.ht = ht;
    this.leadingJetPt = leading;
  }

}

/** Clears the keep-flag of leptons whose cone sum exceeds max_relative_isolation x pT; returns how many stay. */
function applyIsolation(list: ObjectList, keep: Uint8Array, sums: Float64Array, cuts: LeptonDefinition): number {
  const isolate = cuts.maxRelativeIsolation !== Infinity;
  let kept = 0;
  for (let i = 0; i < list.size; i++) {
    if (keep[i] !== 1) continue;
    if (isolate && sums[i]! > cuts.maxRelativeIsolation * list.pt[i]!) keep[i] = 0;
    else kept++;
  }
  return kept;
}
