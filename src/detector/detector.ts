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
import type { EventRecord } from '../generator/eventRecord.js';
import type { RandomStream } from '../physics/random.js';
import { DepositList } from './depositList.js';
import { buildJets } from './jetBuilding.js';
import { softTermWidth } from './missingMomentum.js';
import { KINEMATICS_SLOTS, K_ABS_ETA, K_E, K_ETA, K_PHI, K_PT, K_PX, K_PY, K_PZ } from './kinematicsSlots.js';
import { FLAVOUR_BOTTOM, FLAVOUR_CHARM, FLAVOUR_LIGHT, FLAVOUR_TAU, KIND_ELECTRON, KIND_HADRON, KIND_INVISIBLE, KIND_MUON, KIND_PARTON, KIND_UNDECAYED, KIND_UNKNOWN, particleKind, partonFlavour, tauAncestor, unseenParticleError } from './particleKinds.js';
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
  /** The object in hand (layout of kinematicsSlots.ts). */
  private readonly k = new Float64Array(KINEMATICS_SLOTS);
  /** Soft term: sum px, sum py and scalar sum pT of the unclustered visible particles, GeV. */
  private readonly soft = new Float64Array(3);

  constructor(profile: DetectorProfile) {
    this.profile = profile;
  }

  reconstruct(record: EventRecord, rng: RandomStream, out: RecoEvent): void {
    out.clear();
    out.weight = record.weight;
    this.deposits.clear();
    this.tauSystems.clear();
    this.soft.fill(0);
    const calorimeterAbsEta = this.profile.calorimeterAbsEta;
    const k = this.k;
    const m = record.momentum;
    for (let i = 0; i < record.size; i++) {
      if (record.status[i] !== 1) continue;
      const id = record.pdgId[i]!;
      const absId = id < 0 ? -id : id;
      const kind = particleKind(absId);
      if (kind === KIND_INVISIBLE) continue;
      if (kind === KIND_UNDECAYED || kind === KIND_UNKNOWN) throw unseenParticleError(kind, id, i);
      const o = 4 * i;
      const px = m[o]!;
      const py = m[o + 1]!;
      const pz = m[o + 2]!;
      const pt = Math.sqrt(px * px + py * py);
      if (!(pt > 0)) continue; // along the beam pipe: unseen
      const eta = Math.asinh(pz / pt);
      k[K_PX] = px;
      k[K_PY] = py;
      k[K_PZ] = pz;
      k[K_E] = m[o + 3]!;
      k[K_PT] = pt;
      k[K_ETA] = eta;
      k[K_ABS_ETA] = eta < 0 ? -eta : eta;
      if (kind === KIND_ELECTRON || kind === KIND_MUON) {
        this.chargedLepton(kind === KIND_ELECTRON, id, rng, out);
        continue;
      }
      const tau = kind === KIND_HADRON ? tauAncestor(record, i) : -1;
      if (tau >= 0) {
        this.addToTauSystem(tau, record.pdgId[tau]!);
      } else if (k[K_ABS_ETA]! < calorimeterAbsEta) {
        k[K_PHI] = Math.atan2(py, px);
        this.deposits.addFromKinematics(k, kind === KIND_PARTON ? partonFlavour(absId) : FLAVOUR_LIGHT, id);
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

  /** The electron or muon in hand: identified and measured, or else a calorimeter deposit (electron) or soft activity (muon). */
  private chargedLepton(electron: boolean, id: number, rng: RandomStream, out: RecoEvent): void {
    const k = this.k;
    const response = electron ? this.profile.electrons : this.profile.muons;
    // PDG ids 11 and 13 are the negatively charged leptons.
    const charge = id > 0 ? -1 : 1;
    if (rng.nextUint32() * UINT32_TO_UNIT < response.efficiency.probability(k[K_PT]!, k[K_ABS_ETA]!)) {
      this.measure(response, charge, id, rng, electron ? out.electrons : out.muons);
    } else if (electron) {
      if (k[K_ABS_ETA]! < this.profile.calorimeterAbsEta) {
        k[K_PHI] = Math.atan2(k[K_PY]!, k[K_PX]!);
        this.deposits.addFromKinematics(k, FLAVOUR_LIGHT, id);
      }
    } else if (k[K_ABS_ETA]! < this.profile.trackerAbsEta) {
      this.addSoft();
    }
  }

  /**
   * Smears the identified lepton or tau in hand (four-momentum times 1 + sigma z),
   * applies the charge flip and appends it to `list`, unless its measured
   * momentum would not be positive.
   */
  private measure(response: LeptonResponse, charge: number, truthId: number, rng: RandomStream, list: ObjectList): void {
    const k = this.k;
    const absEta = k[K_ABS_ETA]!;
    const f = 1 + relativeWidth(response.resolution, k, absEta) * rng.normal();
    const flipped = rng.nextUint32() * UINT32_TO_UNIT < response.chargeFlip.at(absEta) ? 1 : 0;
    if (!(f > 0)) return;
    k[K_PHI] = Math.atan2(k[K_PY]!, k[K_PX]!);
    scaleMomentum(k, f);
    list.addFromKinematics(k, flipped === 1 ? -charge : charge, flipped, truthId);
  }

  /** Adds the hadron in hand to the visible system of the tau at record index `tauIndex`. */
  private addToTauSystem(tauIndex: number, tauId: number): void {
    const systems = this.tauSystems;
    const k = this.k;
    for (let s = 0; s < systems.size; s++) {
      if (this.tauMother[s] === tauIndex) {
        systems.addMomentum(s, k[K_PX]!, k[K_PY]!, k[K_PZ]!, k[K_E]!);
        return;
      }
    }
    const s = systems.add(k[K_PX]!, k[K_PY]!, k[K_PZ]!, k[K_E]!, 0, 0, 0, FLAVOUR_TAU, tauId);
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
    const k = this.k;
    for (let s = 0; s < systems.size; s++) {
      systems.updateAngles(s);
      if (!(systems.pt[s]! > 0)) continue;
      systems.loadKinematics(s, k);
      const tauId = systems.truthId[s]!;
      // The visible system carries the tau's charge (the neutrino is neutral); PDG id 15 is the tau-.
      const charge = tauId > 0 ? -1 : 1;
      if (rng.nextUint32() * UINT32_TO_UNIT < response.efficiency.probability(k[K_PT]!, k[K_ABS_ETA]!)) {
        this.measure(response, charge, tauId, rng, out.taus);
      } else if (k[K_ABS_ETA]! < this.profile.calorimeterAbsEta) {
        this.deposits.addFromKinematics(k, FLAVOUR_TAU, tauId);
      }
    }
  }

  private buildAndMeasureJets(rng: RandomStream, out: RecoEvent): void {
    const p = this.profile;
    if (this.order.length < this.deposits.size) this.order = new Int32Array(2 * this.deposits.size);
    buildJets(this.deposits, p.jets.radius, this.jets, this.order);
    const jets = this.jets;
    const tagging = p.bTagging;
    const k = this.k;
    for (let j = 0; j < jets.size; j++) {
      if (!(jets.pt[j]! > 0)) continue;
      jets.loadKinematics(j, k);
      const pt = k[K_PT]!;
      const absEta = k[K_ABS_ETA]!;
      let sigma = relativeWidth(p.jets.resolution, k, absEta);
      if (p.jets.tailFraction > 0 && rng.nextUint32() * UINT32_TO_UNIT < p.jets.tailFraction) sigma *= p.jets.tailWidthFactor;
      const f = 1 + sigma * rng.normal();
      if (!(f > 0)) continue; // measured energy truncated at zero: nothing seen
      if (!(pt * f >= p.jets.minPt) || !(absEta < p.jets.absEtaMax)) {
        this.addSoft(); // the soft term is measured with its own resolution
        continue;
      }
      const flavour = jets.flavour[j]!;
      const truthId = jets.truthId[j]!;
      scaleMomentum(k, f);
      if (flavour !== FLAVOUR_TAU) {
        const fake = p.taus.jetFakeRate.probability(pt, absEta);
        if (fake > 0 && rng.nextUint32() * UINT32_TO_UNIT < fake) {
          // A jet faking a tau has no preferred charge sign (common practice).
          out.taus.addFromKinematics(k, rng.nextUint32() < 0x80000000 ? -1 : 1, 0, truthId);
          continue;
        }
      }
      const table = flavour === FLAVOUR_BOTTOM ? tagging.b : flavour === FLAVOUR_CHARM ? tagging.c : flavour === FLAVOUR_TAU ? tagging.tau : tagging.light;
      const tagProbability = table.probability(pt, absEta);
      const tag = tagProbability > 0 && rng.nextUint32() * UINT32_TO_UNIT < tagProbability ? 1 : 0;
      out.jets.addFromKinematics(k, 0, tag, truthId);
    }
  }

  /** Adds the object in hand, unmeasured, to the soft term. */
  private addSoft(): void {
    this.soft[0] += this.k[K_PX]!;
    this.soft[1] += this.k[K_PY]!;
    this.soft[2] += this.k[K_PT]!;
  }

  private missingMomentum(rng: RandomStream, out: RecoEvent): void {
    const soft = this.soft;
    const x = -soft[0]! - sumComponent(out.electrons, 0) - sumComponent(out.muons, 0) - sumComponent(out.taus, 0) - sumComponent(out.jets, 0);
    const y = -soft[1]! - sumComponent(out.electrons, 1) - sumComponent(out.muons, 1) - sumComponent(out.taus, 1) - sumComponent(out.jets, 1);
    const sigma = softTermWidth(this.profile.softTerm.constant, this.profile.softTerm.stochastic, soft[2]!);
    out.metX = x + sigma * rng.normal();
    out.metY = y + sigma * rng.normal();
  }
}

/** Sum of the x (`component` 0) or y (1) momentum components of a list. */
function sumComponent(list: ObjectList, component: number): number {
  const mom = list.momentum;
  let sum = 0;
  for (let i = 0; i < list.size; i++) sum += mom[4 * i + component]!;
  return sum;
}

/** sigma_X / X of a smearing rule for the object in hand. */
function relativeWidth(resolution: MeasuredResolution, k: Float64Array, absEta: number): number {
  return resolution.table.relativeWidth(resolution.measured === 'pt' ? k[K_PT]! : k[K_E]!, absEta);
}

/** Multiplies the four-momentum and pT of the object in hand by `f` (direction kept). */
function scaleMomentum(k: Float64Array, f: number): void {
  k[K_PX] = f * k[K_PX]!;
  k[K_PY] = f * k[K_PY]!;
  k[K_PZ] = f * k[K_PZ]!;
  k[K_E] = f * k[K_E]!;
  k[K_PT] = f * k[K_PT]!;
}
