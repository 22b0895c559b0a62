/**
 * Isolation cone sums of every electron and muon candidate of an event, for
 * one cone size: the summed pT of all other reconstructed candidates (any
 * kind, any pT) within Delta R < cone. Computed once per event and shared by
 * all analyses that use the same cone.
 */
import type { ObjectList, RecoEvent } from '../detector/recoEvent.js';
import { within } from './objectGeometry.js';

export class IsolationSums {
  /** Squared cone size. */
  readonly cone2: number;
  /** Sums of the electrons and muons, by their index in the event's lists, GeV. */
  electrons = new Float64Array(8);
  muons = new Float64Array(8);
  private readonly lists: ObjectList[] = [];

  /** @param cone Delta R cone of the sum. */
  constructor(cone: number) {
    this.cone2 = cone * cone;
  }

  /** Fills the sums for `event`. */
  compute(event: RecoEvent): void {
    if (this.electrons.length < event.electrons.size) this.electrons = new Float64Array(2 * event.electrons.size);
    if (this.muons.length < event.muons.size) this.muons = new Float64Array(2 * event.muons.size);
    const lists = this.lists;
    lists[0] = event.electrons;
    lists[1] = event.muons;
    lists[2] = event.taus;
    lists[3] = event.jets;
    this.fill(event.electrons, this.electrons);
    this.fill(event.muons, this.muons);
  }

  private fill(leptons: ObjectList, sums: Float64Array): void {
    const cone2 = this.cone2;
    for (let i = 0; i < leptons.size; i++) {
      const eta = leptons.eta[i]!;
      const phi = leptons.phi[i]!;
      let sum = 0;
      for (let l = 0; l < 4; l++) {
        const others = this.lists[l]!;
        for (let j = 0; j < others.size; j++) {
          if (others === leptons && j === i) continue;
          if (within(eta, phi, others.eta[j]!, others.phi[j]!, cone2)) sum += others.pt[j]!;
        }
      }
      sums[i] = sum;
    }
  }
}
