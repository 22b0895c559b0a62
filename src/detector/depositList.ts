/**
 * Calorimeter deposits before and after jet building: partons, photons,
 * unidentified electrons and unidentified tau visible systems, in flat arrays
 * reused from event to event.
 */
import { K_ABS_ETA, K_E, K_ETA, K_PHI, K_PT, K_PX, K_PY, K_PZ } from './kinematicsSlots.js';

export class DepositList {
  size = 0;
  capacity: number;
  px: Float64Array;
  py: Float64Array;
  pz: Float64Array;
  e: Float64Array;
  pt: Float64Array;
  eta: Float64Array;
  phi: Float64Array;
  /** FLAVOUR_* label of particleKinds.ts. */
  flavour: Uint8Array;
  /** Signed PDG id of the particle that set the flavour (or of the hardest constituent). */
  truthId: Int32Array;

  constructor(capacity = 32) {
    this.capacity = capacity;
    this.px = new Float64Array(capacity);
    this.py = new Float64Array(capacity);
    this.pz = new Float64Array(capacity);
    this.e = new Float64Array(capacity);
    this.pt = new Float64Array(capacity);
    this.eta = new Float64Array(capacity);
    this.phi = new Float64Array(capacity);
    this.flavour = new Uint8Array(capacity);
    this.truthId = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  /** Appends a deposit whose pT, eta and phi the caller already knows. */
  add(px: number, py: number, pz: number, e: number, pt: number, eta: number, phi: number, flavour: number, truthId: number): number {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    this.px[i] = px;
    this.py[i] = py;
    this.pz[i] = pz;
    this.e[i] = e;
    this.pt[i] = pt;
    this.eta[i] = eta;
    this.phi[i] = phi;
    this.flavour[i] = flavour;
    this.truthId[i] = truthId;
    return i;
  }

  /** Appends a deposit from a kinematics array (layout of kinematicsSlots.ts). */
  addFromKinematics(k: Float64Array, flavour: number, truthId: number): number {
    return this.add(k[K_PX]!, k[K_PY]!, k[K_PZ]!, k[K_E]!, k[K_PT]!, k[K_ETA]!, k[K_PHI]!, flavour, truthId);
  }

  /** Copies deposit `i` into a kinematics array (|eta| included). */
  loadKinematics(i: number, k: Float64Array): void {
    k[K_PX] = this.px[i]!;
    k[K_PY] = this.py[i]!;
    k[K_PZ] = this.pz[i]!;
    k[K_E] = this.e[i]!;
    k[K_PT] = this.pt[i]!;
    const eta = this.eta[i]!;
    k[K_ETA] = eta;
    k[K_ABS_ETA] = eta < 0 ? -eta : eta;
    k[K_PHI] = this.phi[i]!;
  }

  /** Adds a four-momentum to deposit `i` (pT, eta and phi are recomputed by `updateAngles`). */
  addMomentum(i: number, px: number, py: number, pz: number, e: number): void {
    this.px[i] += px;
    this.py[i] += py;
    this.pz[i] += pz;
    this.e[i] += e;
  }

  /** Recomputes pT, eta and phi of deposit `i` from its momentum. */
  updateAngles(i: number): void {
    const px = this.px[i]!;
    const py = this.py[i]!;
    const pt = Math.sqrt(px * px + py * py);
    this.pt[i] = pt;
    this.eta[i] = pt > 0 ? Math.asinh(this.pz[i]! / pt) : this.pz[i]! >= 0 ? 1e9 : -1e9;
    this.phi[i] = Math.atan2(py, px);
  }

  private grow(): void {
    const n = this.capacity * 2;
    const f = (a: Float64Array): Float64Array => {
      const b = new Float64Array(n);
      b.set(a);
      return b;
    };
    this.px = f(this.px);
    this.py = f(this.py);
    this.pz = f(this.pz);
    this.e = f(this.e);
    this.pt = f(this.pt);
    this.eta = f(this.eta);
    this.phi = f(this.phi);
    const flavour = new Uint8Array(n);
    flavour.set(this.flavour);
    this.flavour = flavour;
    const truthId = new Int32Array(n);
    truthId.set(this.truthId);
    this.truthId = truthId;
    this.capacity = n;
  }
}
