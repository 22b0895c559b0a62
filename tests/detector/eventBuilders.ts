/**
 * Hand-built parton-level events for the detector tests: particles placed by
 * (pT, eta, phi, mass), mothers as the generator writes them.
 */
import { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from '../../src/generator/eventRecord.js';
import { M_TAU, M_W, M_Z } from '../../src/physics/constants.js';
import { setPtEtaPhiM } from '../../src/physics/fourVector.js';

const scratch = new Float64Array(4);

/** Appends a particle given by pT (GeV), eta, phi and mass (GeV); returns its index. */
export function addParticle(record: EventRecord, id: number, status: number, mother: number, pt: number, eta: number, phi: number, mass = 0): number {
  setPtEtaPhiM(scratch, 0, pt, eta, phi, mass);
  return record.add(id, status, mother, mother, scratch[0]!, scratch[1]!, scratch[2]!, scratch[3]!, mass);
}

/** Two incoming partons along the beam (status -1), as every generated event starts. */
export function addBeams(record: EventRecord, energy = 500): void {
  record.add(2, STATUS_INCOMING, -1, -1, 0, 0, energy, energy, 0);
  record.add(-2, STATUS_INCOMING, -1, -1, 0, 0, -energy, energy, 0);
}

/** A Z at rest in the transverse plane decaying to a lepton pair back to back: Z -> l- l+ (`lepton` = 11 or 13). */
export function zToLeptons(record: EventRecord, lepton: number, eta1 = 0.3, eta2 = -0.5, phi = 0.7): void {
  record.clear();
  addBeams(record);
  const z = record.add(23, STATUS_DECAYED, 0, 1, 0, 0, 0, M_Z, M_Z);
  // Back to back in the transverse plane with pT chosen so that the pair mass is M_Z:
  // m^2 = 2 pT^2 (cosh(deta) + 1) for two massless back-to-back leptons.
  const pt = M_Z / Math.sqrt(2 * (Math.cosh(eta1 - eta2) + 1));
  addParticle(record, lepton, STATUS_FINAL, z, pt, eta1, phi);
  addParticle(record, -lepton, STATUS_FINAL, z, pt, eta2, phi - Math.PI);
}

/** A hadronic tau: tau (status 2) -> visible hadron `visibleId` + nu_tau, with the visible system at (pt, eta, phi). */
export function addHadronicTau(record: EventRecord, tauId: number, pt: number, eta: number, phi: number, visibleId = 211): number {
  const tau = addParticle(record, tauId, STATUS_DECAYED, 0, 1.3 * pt, eta, phi, M_TAU);
  // tau- (PDG 15) -> h- nu_tau: the visible hadron has the tau's charge, the neutrino its lepton number.
  addParticle(record, -Math.sign(tauId) * Math.abs(visibleId), STATUS_FINAL, tau, pt, eta, phi, 0.14);
  addParticle(record, Math.sign(tauId) * 16, STATUS_FINAL, tau, 0.3 * pt, eta, phi);
  return tau;
}

/** A top-like decay chain: t -> b W+, W+ -> e+ nu_e (tops and W as status-2 intermediates). */
export function topToBElectron(record: EventRecord): void {
  record.clear();
  addBeams(record);
  const top = addParticle(record, 6, STATUS_DECAYED, 0, 60, 0.2, 0.1, 172.57);
  addParticle(record, 5, STATUS_FINAL, top, 80, 0.4, 1.2, 4.7);
  const w = addParticle(record, 24, STATUS_DECAYED, top, 70, -0.1, -1.6, M_W);
  addParticle(record, -11, STATUS_FINAL, w, 45, 0.6, -1.0);
  addParticle(record, 12, STATUS_FINAL, w, 40, -0.9, -2.4);
}
