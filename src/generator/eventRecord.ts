/**
 * The event record: one collision's particles in flat typed arrays, reused
 * from event to event (no per-event allocation).
 *
 * The fields follow the Les Houches Event standard (hep-ph/0609017) so an LHE
 * event maps onto the record one-to-one: PDG id, status (-1 incoming, 1 final
 * state, 2 intermediate that has decayed), two mother pointers, two colour
 * tags, four-momentum, generated mass, spin. Mothers are 0-based indices into
 * the record, -1 for none (LHE files count from 1 with 0 for none; the LHE
 * reader and writer convert).
 */

/** Status codes of the LHE standard used by tamis. */
export const STATUS_INCOMING = -1;
export const STATUS_FINAL = 1;
export const STATUS_DECAYED = 2;

export class EventRecord {
  /** Number of particles in the current event. */
  size = 0;
  capacity: number;
  pdgId: Int32Array;
  status: Int8Array;
  mother1: Int16Array;
  mother2: Int16Array;
  colour1: Int32Array;
  colour2: Int32Array;
  /** Four-momenta, (px, py, pz, E) per particle, GeV (layout of physics/fourVector). */
  momentum: Float64Array;
  /** Generated mass of each particle, GeV. */
  mass: Float64Array;
  /** Cosine of the angle between spin and three-momentum in the lab (LHE SPINUP); 9 = unknown. */
  spin: Float32Array;

  /** Event weight (unweighted events: the sample's cross section per event, or 1). */
  weight = 1;
  /** Scale of the hard process, GeV. */
  scale = 0;
  alphaQed = 0;
  alphaQcd = 0;
  /** Process id (LHE IDPRUP) of the hard process that made this event. */
  processId = 0;

  constructor(capacity = 64) {
    this.capacity = capacity;
    this.pdgId = new Int32Array(capacity);
    this.status = new Int8Array(capacity);
    this.mother1 = new Int16Array(capacity);
    this.mother2 = new Int16Array(capacity);
    this.colour1 = new Int32Array(capacity);
    this.colour2 = new Int32Array(capacity);
    this.momentum = new Float64Array(4 * capacity);
    this.mass = new Float64Array(capacity);
    this.spin = new Float32Array(capacity);
  }

  /** Empties the record for the next event (keeps the buffers). */
  clear(): void {
    this.size = 0;
    this.weight = 1;
    this.scale = 0;
    this.alphaQed = 0;
    this.alphaQcd = 0;
    this.processId = 0;
  }

  /** Appends a particle and returns its index. Grows the buffers when full (rare). */
  add(pdgId: number, status: number, mother1: number, mother2: number, px: number, py: number, pz: number, e: number, mass: number): number {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    this.pdgId[i] = pdgId;
    this.status[i] = status;
    this.mother1[i] = mother1;
    this.mother2[i] = mother2;
    this.colour1[i] = 0;
    this.colour2[i] = 0;
    const o = 4 * i;
    this.momentum[o] = px;
    this.momentum[o + 1] = py;
    this.momentum[o + 2] = pz;
    this.momentum[o + 3] = e;
    this.mass[i] = mass;
    this.spin[i] = 9;
    return i;
  }

  /** Indices of the daughters of particle `i` (particles whose first or second mother is `i`). Allocates: not for hot loops. */
  daughtersOf(i: number): number[] {
    const out: number[] = [];
    for (let j = 0; j < this.size; j++) if (this.mother1[j] === i || (this.mother2[j] === i && this.mother1[j] !== i)) out.push(j);
    return out;
  }

  /** A deep copy of the current event (for tests and for keeping an event). */
  copy(): EventRecord {
    const c = new EventRecord(Math.max(this.size, 1));
    c.copyFrom(this);
    return c;
  }

  /** Replaces this event's content by `other`'s. */
  copyFrom(other: EventRecord): void {
    while (this.capacity < other.size) this.grow();
    const n = other.size;
    this.size = n;
    this.pdgId.set(other.pdgId.subarray(0, n));
    this.status.set(other.status.subarray(0, n));
    this.mother1.set(other.mother1.subarray(0, n));
    this.mother2.set(other.mother2.subarray(0, n));
    this.colour1.set(other.colour1.subarray(0, n));
    this.colour2.set(other.colour2.subarray(0, n));
    this.momentum.set(other.momentum.subarray(0, 4 * n));
    this.mass.set(other.mass.subarray(0, n));
    this.spin.set(other.spin.subarray(0, n));
    this.weight = other.weight;
    this.scale = other.scale;
    this.alphaQed = other.alphaQed;
    this.alphaQcd = other.alphaQcd;
    this.processId = other.processId;
  }

  private grow(): void {
    const capacity = this.capacity * 2;
    const grow = <T extends Int32Array | Int8Array | Int16Array | Float64Array | Float32Array>(a: T, n: number): T => {
      const b = new (a.constructor as new (n: number) => T)(n);
      b.set(a);
      return b;
    };
    this.pdgId = grow(this.pdgId, capacity);
    this.status = grow(this.status, capacity);
    this.mother1 = grow(this.mother1, capacity);
    this.mother2 = grow(this.mother2, capacity);
    this.colour1 = grow(this.colour1, capacity);
    this.colour2 = grow(this.colour2, capacity);
    this.momentum = grow(this.momentum, 4 * capacity);
    this.mass = grow(this.mass, capacity);
    this.spin = grow(this.spin, capacity);
    this.capacity = capacity;
  }
}
