/**
 * Hand-built reconstructed events for the selection tests: objects are
 * placed by (pT, eta, phi) as massless four-vectors, E = |p|.
 */
import { RecoEvent, type ObjectList } from '../../src/detector/recoEvent.js';

export function addObject(list: ObjectList, pt: number, eta: number, phi: number, charge = 0, tag = 0, truthId = 0): void {
  const px = pt * Math.cos(phi);
  const py = pt * Math.sin(phi);
  const pz = pt * Math.sinh(eta);
  list.add(px, py, pz, Math.hypot(px, py, pz), charge, tag, truthId);
}

export interface EventSpec {
  electrons?: [pt: number, eta: number, phi: number, charge: number][];
  muons?: [pt: number, eta: number, phi: number, charge: number][];
  taus?: [pt: number, eta: number, phi: number, charge: number][];
  /** tag 1 = b-tagged. */
  jets?: [pt: number, eta: number, phi: number, tag: number][];
  met?: [magnitude: number, phi: number];
  weight?: number;
}

/** Fills `event` (cleared first) from a compact description. */
export function fillEvent(event: RecoEvent, spec: EventSpec): RecoEvent {
  event.clear();
  for (const [pt, eta, phi, q] of spec.electrons ?? []) addObject(event.electrons, pt, eta, phi, q, 0, -11 * q);
  for (const [pt, eta, phi, q] of spec.muons ?? []) addObject(event.muons, pt, eta, phi, q, 0, -13 * q);
  for (const [pt, eta, phi, q] of spec.taus ?? []) addObject(event.taus, pt, eta, phi, q, 0, -15 * q);
  for (const [pt, eta, phi, tag] of spec.jets ?? []) addObject(event.jets, pt, eta, phi, 0, tag, tag === 1 ? 5 : 1);
  const [met, metPhi] = spec.met ?? [0, 0];
  event.metX = met * Math.cos(metPhi);
  event.metY = met * Math.sin(metPhi);
  event.weight = spec.weight ?? 1;
  return event;
}

export function makeEvent(spec: EventSpec): RecoEvent {
  return fillEvent(new RecoEvent(), spec);
}
