/**
 * Flat, reusable storage of selected objects, and the keep-flags used while
 * selecting them. Refilled per event; grows (rarely) but never shrinks.
 */
import type { ObjectList } from '../detector/recoEvent.js';

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
    const m = this.momentum;
    const a = 4 * from;
    const b = 4 * to;
    m[b] = m[a]!;
    m[b + 1] = m[a + 1]!;
    m[b + 2] = m[a + 2]!;
    m[b + 3] = m[a + 3]!;
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
export class Flags {
  keep = new Uint8Array(16);
  reset(size: number): Uint8Array {
    if (this.keep.length < size) this.keep = new Uint8Array(2 * size);
    return this.keep;
  }
}

