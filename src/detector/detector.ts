/**
 * The parametrised detector: builds reconstructed objects from a parton-level
 * event record with one era's profile.
 *
 * - Electrons and muons (status 1, including those from tau, W and Z decays):
 *   identified with the profile's efficiency at their true pT and |eta|,
 *   smeared, and given the wrong charge with the charge-flip rate. An
 *   unidentified electron is still a calorimeter deposit, so it becomes a jet;
 *   an unidentified muon inside the tracker goes into the soft term.
 * - Hadronic taus: the status-1 hadrons with a tau among their ancestors form
 *   the tau's visible system, identified with the tau efficiency and smeared;
 *   an unidentified one is a jet (it is a jet in the calorimeter).
 * - Quarks, gluons, photons and other hadrons are calorimeter deposits, merged
 *   into jets (jetBuilding.ts) and smeared with the jet energy resolution. A jet
 *   may be identified as a tau with the profile's fake rate (it then leaves the
 *   jet list); others are b-tagged by flavour. Jets below the detector
 *   threshold or beyond the jet acceptance go into the soft term.
 * - Neutrinos (and the stable neutral new particles of particleKinds.ts) are invisible.
 * - Missing transverse momentum: missingMomentum.ts.
 *
 * Efficiencies and rates are looked up at the true pT and |eta| of the object
 * (for jets: of the merged partons); detector thresholds apply to the smeared
 * pT. Smearing multiplies the four-momentum by 1 + sigma z, z standard normal,
 * keeping the direction; an object whose factor is not positive is lost
 * (truncation at zero measured energy). Random numbers come only from the
 * stream passed in, in a fixed order: leptons in record order, tau systems,
 * jets in decreasing pT, then the soft term.
 */
import { TamisError } from '../errors.js';
import type { EventRecord } from '../generator/eventRecord.js';
import type { RandomStream } from '../physics/random.js';
import { DepositList } from './depositList.js';
import { buildJets } from './jetBuilding.js';
import { softTermWidth } from './missingMomentum.js';
import { FLAVOUR_BOTTOM, FLAVOUR_CHARM, FLAVOUR_LIGHT, FLAVOUR_TAU, KIND_ELECTRON, KIND_HADRON, KIND_INVISIBLE, KIND_MUON, KIND_PARTON, KIND_PHOTON, KIND_UNDECAYED, particleKind, partonFlavour } from './particleKinds.js';
import type { DetectorProfile, LeptonResponse, MeasuredResolution } from './profile/detectorProfile.js';
import type { ObjectList, RecoEvent } from './recoEvent.js';

/** Turns an event record into reconstructed objects. One per worker: it keeps scratch buffers. */
export interface Detector {
  readonly profile: DetectorProfile;
  /**
   * Fills `out` (cleared first) with the objects and missing momentum of `record`,
   * drawing random numbers only from `rng`.
   *
   * @throws TamisError (`bad_input`) when a final-state particle is one the generator should have decayed (top, tau, W, Z, Higgs) or an unknown stable particle
   */
  reconstruct(record: EventRecord, rng: RandomStream, out: RecoEvent): void;
}

/**
 * A detector with the response of `profile`.
 *
 * @example
 * const detector = createDetector(findDetectorProfile('generic-13tev'));
 * detector.reconstruct(record, RandomStream.forStream(seed, eventIndex), recoEvent);
 */
export function createDetector(profile: DetectorProfile): Detector {
  return new ParametrisedDetector(profile);
}

/** 2^-32: turns a 32-bit random integer into a uniform number in [0, 1), enough resolution for efficiency decisions. */
const UINT32_TO_UNIT = 2.3283064365386963e-10;

class ParametrisedDetector implements Detector {
  readonly profile: DetectorProfile;
  private readonly deposits = new DepositList(32);
  private readonly jets = new DepositList(32);
  private readonly tauSystems = new DepositList(8);
  private tauMother = new Int32Array(8);
  private order = new Int32Array(32);
  private softX = 0;
  private softY = 0;
  private softSumPt = 0;

  constructor(profile: DetectorProfile) {
    this.profile = profile;
  }

  reconstruct(record: EventRecord, rng: RandomStream, out: RecoEvent): void {
    const p = this.profile;
    out.clear();
    out.weight = record.weight;
    this.deposits.clear();
    this.tauSystems.clear();
    this.softX = 0;
    this.softY = 0;
    this.softSumPt = 0;
    const m = record.momentum;
    for (let i = 0; i < record.size; i++) {
      if (record.status[i] !== 1) continue;
      const id = record.pdgId[i]!;
      const absId = id < 0 ? -id : id;
      const kind = particleKind(absId);
      if (kind === KIND_INVISIBLE) continue;
      const o = 4 * i;
      const px = m[o]!;
      const py = m[o + 1]!;
      const pz = m[o + 2]!;
      const e = m[o + 3]!;
      const pt = Math.sqrt(px * px + py * py);
      if (!(pt > 0)) continue; // along the beam pipe: unseen
      const eta = Math.asinh(pz / pt);
      const absEta = eta < 0 ? -eta : eta;
      if (kind === KIND_ELECTRON || kind === KIND_MUON) {
        this.chargedLepton(kind, id, px, py, pz, e, pt, eta, absEta, rng, out);
      } else if (kind === KIND_PARTON || kind === KIND_PHOTON || kind === KIND_HADRON) {
        const tau = kind === KIND_HADRON ? tauAncestor(record, i) : -1;
        if (tau >= 0) this.addToTauSystem(tau, record.pdgId[tau]!, px, py, pz, e);
        else if (absEta < p.calorimeterAbsEta) this.deposits.add(px, py, pz, e, pt, eta, Math.atan2(py, px), kind === KIND_PARTON ? partonFlavour(absId) : FLAVOUR_LIGHT, id);
      } else {
        throw unseenParticle(kind, id, i);
      }
    }
    this.hadronicTaus(rng, out);
    this.buildAndMeasureJets(rng, out);
    this.missingMomentum(rng, out);
    out.electrons.sortByPt();
    out.muons.sortByPt();
    out.taus.sortByPt();
    out.jets.sortByPt();
  }

  private chargedLepton(kind: number, id: number, px: number, py: number, pz: number, e: number, pt: number, eta: number, absEta: number, rng: RandomStream, out: RecoEvent): void {
    const electron = kind === KIND_ELECTRON;
    const response = electron ? this.profile.electrons : this.profile.muons;
    // PDG ids 11 and 13 are the negatively charged leptons.
    const charge = id > 0 ? -1 : 1;
    if (rng.nextUint32() * UINT32_TO_UNIT < response.efficiency.probability(pt, absEta)) {
      measureLepton(response, px, py, pz, e, pt, eta, absEta, charge, id, rng, electron ? out.electrons : out.muons);
    } else if (electron) {
      if (absEta < this.profile.calorimeterAbsEta) this.deposits.add(px, py, pz, e, pt, eta, Math.atan2(py, px), FLAVOUR_LIGHT, id);
    } else if (absEta < this.profile.trackerAbsEta) {
      this.addSoft(px, py, pt);
    }
  }

  private addToTauSystem(tauIndex: number, tauId: number, px: number, py: number, pz: number, e: number): void {
    const systems = this.tauSystems;
    for (let s = 0; s < systems.size; s++) {
      if (this.tauMother[s] === tauIndex) {
        systems.addMomentum(s, px, py, pz, e);
        return;
      }
    }
    const s = systems.add(px, py, pz, e, 0, 0, 0, FLAVOUR_TAU, tauId);
    if (s >= this.tauMother.length) {
      const grown = new Int32Array(2 * this.tauMother.length);
      grown.set(this.tauMother);
      this.tauMother = grown;
    }
    this.tauMother[s] = tauIndex;
  }

  private hadronicTaus(rng: RandomStream, out: RecoEvent): void {
    const systems = this.tauSystems;
    const response = this.profile.taus;
    for (let s = 0; s < systems.size; s++) {
      systems.updateAngles(s);
      const pt = systems.pt[s]!;
      if (!(pt > 0)) continue;
      const px = systems.px[s]!;
      const py = systems.py[s]!;
      const pz = systems.pz[s]!;
      const e = systems.e[s]!;
      const eta = systems.eta[s]!;
      const absEta = eta < 0 ? -eta : eta;
      const tauId = systems.truthId[s]!;
      // The visible system carries the tau's charge (the neutrino is neutral); PDG id 15 is the tau-.
      const charge = tauId > 0 ? -1 : 1;
      if (rng.nextUint32() * UINT32_TO_UNIT < response.efficiency.probability(pt, absEta)) {
        measureLepton(response, px, py, pz, e, pt, eta, absEta, charge, tauId, rng, out.taus);
      } else if (absEta < this.profile.calorimeterAbsEta) {
        this.deposits.add(px, py, pz, e, pt, eta, systems.phi[s]!, FLAVOUR_TAU, tauId);
      }
    }
  }

  private buildAndMeasureJets(rng: RandomStream, out: RecoEvent): void {
    const p = this.profile;
    if (this.order.length < this.deposits.size) this.order = new Int32Array(2 * this.deposits.size);
    buildJets(this.deposits, p.jets.radius, this.jets, this.order);
    const jets = this.jets;
    const tagging = p.bTagging;
    for (let j = 0; j < jets.size; j++) {
      const pt = jets.pt[j]!;
      if (!(pt > 0)) continue;
      const eta = jets.eta[j]!;
      const absEta = eta < 0 ? -eta : eta;
      let sigma = relativeWidth(p.jets.resolution, pt, jets.e[j]!, absEta);
      if (p.jets.tailFraction > 0 && rng.nextUint32() * UINT32_TO_UNIT < p.jets.tailFraction) sigma *= p.jets.tailWidthFactor;
      const f = 1 + sigma * rng.normal();
      if (!(f > 0)) continue; // measured energy truncated at zero: nothing seen
      if (!(pt * f >= p.jets.minPt) || !(absEta < p.jets.absEtaMax)) {
        this.addSoft(jets.px[j]!, jets.py[j]!, pt);
        continue;
      }
      const flavour = jets.flavour[j]!;
      const truthId = jets.truthId[j]!;
      const px = f * jets.px[j]!;
      const py = f * jets.py[j]!;
      const pz = f * jets.pz[j]!;
      const e = f * jets.e[j]!;
      if (flavour !== FLAVOUR_TAU) {
        const fake = p.taus.jetFakeRate.probability(pt, absEta);
        if (fake > 0 && rng.nextUint32() * UINT32_TO_UNIT < fake) {
          // A jet faking a tau has no preferred charge sign (common practice).
          const charge = rng.nextUint32() < 0x80000000 ? -1 : 1;
          out.taus.addMeasured(px, py, pz, e, pt * f, eta, jets.phi[j]!, charge, 0, truthId);
          continue;
        }
      }
      const table = flavour === FLAVOUR_BOTTOM ? tagging.b : flavour === FLAVOUR_CHARM ? tagging.c : flavour === FLAVOUR_TAU ? tagging.tau : tagging.light;
      const tagProbability = table.probability(pt, absEta);
      const tag = tagProbability > 0 && rng.nextUint32() * UINT32_TO_UNIT < tagProbability ? 1 : 0;
      out.jets.addMeasured(px, py, pz, e, pt * f, eta, jets.phi[j]!, 0, tag, truthId);
    }
  }

  private addSoft(px: number, py: number, pt: number): void {
    this.softX += px;
    this.softY += py;
    this.softSumPt += pt;
  }

  private missingMomentum(rng: RandomStream, out: RecoEvent): void {
    const x = -this.softX - sumPx(out.electrons, 0) - sumPx(out.muons, 0) - sumPx(out.taus, 0) - sumPx(out.jets, 0);
    const y = -this.softY - sumPx(out.electrons, 1) - sumPx(out.muons, 1) - sumPx(out.taus, 1) - sumPx(out.jets, 1);
    const sigma = softTermWidth(this.profile.softTerm.constant, this.profile.softTerm.stochastic, this.softSumPt);
    out.metX = x + sigma * rng.normal();
    out.metY = y + sigma * rng.normal();
  }
}

/** Sum of the x (`component` 0) or y (1) momentum components of a list. */
function sumPx(list: ObjectList, component: number): number {
  const mom = list.momentum;
  let sum = 0;
  for (let k = 0; k < list.size; k++) sum += mom[4 * k + component]!;
  return sum;
}

/** sigma_X / X of a smearing rule for an object of pT `pt` and energy `e` (GeV). */
function relativeWidth(resolution: MeasuredResolution, pt: number, e: number, absEta: number): number {
  return resolution.table.relativeWidth(resolution.measured === 'pt' ? pt : e, absEta);
}

/** Smears an identified lepton or tau, applies the charge flip and appends it to `list` (unless its measured momentum would not be positive). */
function measureLepton(response: LeptonResponse, px: number, py: number, pz: number, e: number, pt: number, eta: number, absEta: number, charge: number, truthId: number, rng: RandomStream, list: ObjectList): void {
  const f = 1 + relativeWidth(response.resolution, pt, e, absEta) * rng.normal();
  const flipped = rng.nextUint32() * UINT32_TO_UNIT < response.chargeFlip.at(absEta) ? 1 : 0;
  if (!(f > 0)) return;
  list.addMeasured(f * px, f * py, f * pz, f * e, f * pt, eta, Math.atan2(py, px), flipped === 1 ? -charge : charge, flipped, truthId);
}

/** Index of the tau a hadron descends from through hadrons only (its visible decay system), or -1. */
function tauAncestor(record: EventRecord, i: number): number {
  let mother = record.mother1[i]!;
  for (let depth = 0; depth < 16 && mother >= 0 && mother < record.size; depth++) {
    const id = record.pdgId[mother]!;
    const absId = id < 0 ? -id : id;
    if (absId === 15) return mother;
    if (particleKind(absId) !== KIND_HADRON) return -1;
    mother = record.mother1[mother]!;
  }
  return -1;
}

function unseenParticle(kind: number, id: number, index: number): TamisError {
  if (kind === KIND_UNDECAYED) {
    return new TamisError('bad_input', `final-state particle ${index} (PDG id ${id}) should have decayed before reaching the detector`, {
      suggestion: 'decay tops, taus, W, Z and Higgs bosons first (the generator\'s decay step does this, also for events read from files)',
    });
  }
  return new TamisError('bad_input', `final-state particle ${index} has PDG id ${id}, which the detector does not know how to see`, {
    suggestion: 'the detector sees leptons, quarks, gluons, photons, hadrons and invisible neutral particles; decay other particles first',
  });
}
