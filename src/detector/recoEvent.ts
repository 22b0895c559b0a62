/**
 * Reconstructed event: what the parametrised detector hands to the selection.
 *
 * Objects are *candidates*: identification efficiency, smearing, charge flip
 * and b-tagging are already applied by the detector profile; kinematic
 * thresholds, isolation and overlap removal belong to each analysis's object
 * definitions and are applied by the selection engine. Buffers are reused
 * from event to event (no per-event allocation).
 */
import { K_E, K_ETA, K_PHI, K_PT, K_PX, K_PY, K_PZ } from './kinematicsSlots.js';

/** One kind of reconstructed object (electrons, muons, hadronic taus or jets) in flat arrays. */
export class ObjectList {
  size = 0;
  capacity: number;
  /** Four-momenta (px, py, pz, E), GeV. */
  momentum: Float64Array;
  pt: Float64Array;
  eta: Float64Array;
  phi: Float64Array;
  /** Electric charge in units of e (jets: 0). */
  charge: Int8Array;
  /** Jets: 1 when b-tagged. Leptons and taus: 1 when the reconstructed charge was flipped (truth, for tests). */
  tag: Uint8Array;
  /**
   * PDG id of the generator particle the object came from (truth, for tests and efficiency maps); 0 if unknown.
   * Taus from a real tau carry the tau's id (+-15), taus faked by a jet the jet's; a jet carries the id of
   * the constituent that set its flavour (b, c, a tau, else its hardest parton, photon or unidentified electron).
   */
  truthId: Int32Array;

  constructor(capacity = 16) {
    this.capacity = capacity;
    this.momentum = new Float64Array(4 * capacity);
    this.pt = new Float64Array(capacity);
    this.eta = new Float64Array(capacity);
    this.phi = new Float64Array(capacity);
    this.charge = new Int8Array(capacity);
    this.tag = new Uint8Array(capacity);
    this.truthId = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  /** Appends an object from its four-momentum; pt, eta and phi are computed here. */
  add(px: number, py: number, pz: number, e: number, charge: number, tag: number, truthId: number): number {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    const o = 4 * i;
    this.momentum[o] = px;
    this.momentum[o + 1] = py;
    this.momentum[o + 2] = pz;
    this.momentum[o + 3] = e;
    const ptValue = Math.hypot(px, py);
    this.pt[i] = ptValue;
    this.eta[i] = ptValue > 0 ? Math.asinh(pz / ptValue) : pz >= 0 ? 1e9 : -1e9;
    let phiValue = Math.atan2(py, px);
    if (phiValue === -Math.PI) phiValue = Math.PI;
    this.phi[i] = phiValue;
    this.charge[i] = charge;
    this.tag[i] = tag;
    this.truthId[i] = truthId;
    return i;
  }

  /**
   * Appends an object from a kinematics array laid out as in kinematicsSlots.ts,
   * (px, py, pz, E, pT, eta, phi) at offsets 0 to 6: the detector's fast path,
   * which knows pT, eta and phi already (smearing scales the momentum and keeps
   * the direction).
   */
  addFromKinematics(k: Float64Array, charge: number, tag: number, truthId: number): number {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    const o = 4 * i;
    this.momentum[o] = k[K_PX]!;
    this.momentum[o + 1] = k[K_PY]!;
    this.momentum[o + 2] = k[K_PZ]!;
    this.momentum[o + 3] = k[K_E]!;
    this.pt[i] = k[K_PT]!;
    this.eta[i] = k[K_ETA]!;
    this.phi[i] = k[K_PHI]!;
    this.charge[i] = charge;
    this.tag[i] = tag;
    this.truthId[i] = truthId;
    return i;
  }

  /** Sorts the objects by decreasing pT (insertion sort: lists are short). */
  sortByPt(): void {
    for (let i = 1; i < this.size; i++) {
      for (let j = i; j > 0 && this.pt[j - 1] < this.pt[j]; j--) this.swap(j, j - 1);
    }
  }

  private swap(a: number, b: number): void {
    const m = this.momentum;
    for (let c = 0; c < 4; c++) {
      const t = m[4 * a + c];
      m[4 * a + c] = m[4 * b + c];
      m[4 * b + c] = t;
    }
    let t = this.pt[a];
    this.pt[a] = this.pt[b];
    this.pt[b] = t;
    t = this.eta[a];
    this.eta[a] = this.eta[b];
    this.eta[b] = t;
    t = this.phi[a];
    this.phi[a] = this.phi[b];
    this.phi[b] = t;
    t = this.charge[a];
    this.charge[a] = this.charge[b];
    this.charge[b] = t;
    t = this.tag[a];
    this.tag[a] = this.tag[b];
    this.tag[b] = t;
    t = this.truthId[a];
    this.truthId[a] = this.truthId[b];
    this.truthId[b] = t;
  }

  private grow(): void {
    const n = this.capacity * 2;
    const m = new Float64Array(4 * n);
    m.set(this.momentum);
    this.momentum = m;
    const f = (a: Float64Array) => {
      const b = new Float64Array(n);
      b.set(a);
      return b;
    };
    this.pt = f(this.pt);
    this.eta = f(this.eta);
    this.phi = f(this.phi);
    const c = new Int8Array(n);
    c.set(this.charge);
    this.charge = c;
    const t = new Uint8Array(n);
    t.set(this.tag);
    this.tag = t;
    const id = new Int32Array(n);
    id.set(this.truthId);
    this.truthId = id;
    this.capacity = n;
  }
}

export class RecoEvent {
  electrons = new ObjectList(8);
  muons = new ObjectList(8);
  /** Hadronically decaying tau candidates (visible part). */
  taus = new ObjectList(8);
  jets = new ObjectList(16);
  /** Missing transverse momentum components, GeV: minus the vector sum of everything seen plus the soft term. */
  metX = 0;
  metY = 0;
  /** Event weight carried from the event record. */
  weight = 1;

  clear(): void {
    this.electrons.clear();
    this.muons.clear();
    this.taus.clear();
    this.jets.clear();
    this.metX = 0;
    this.metY = 0;
    this.weight = 1;
  }

  /** Magnitude of the missing transverse momentum, GeV. */
  get met(): number {
    return Math.hypot(this.metX, this.metY);
  }
}
