/**
 * Jets from calorimeter deposits of a parton-level event.
 *
 * With no parton shower, a jet is one parton, unless two partons are closer
 * than the jet radius. Deposits are taken in decreasing pT; each joins the
 * first (hardest) jet whose seed axis lies within Delta R < radius, or seeds a
 * new jet. For hard, well-separated partons this gives the same jets as
 * sequential-recombination algorithms with the same radius such as anti-kt
 * (Cacciari, Salam, Soyez, JHEP 04 (2008) 063, arXiv:0802.1189), whose jets
 * grow as cones around the hardest particles. The jet flavour is the highest
 * of its constituents, b > c > tau > light (a jet containing a b quark is a b
 * jet: common practice).
 */
import type { DepositList } from './depositList.js';

const TWO_PI = 2 * Math.PI;

/**
 * Clusters `deposits` into `jets` (cleared first) with radius `radius` (0: one
 * jet per deposit). `order` is scratch space of at least `deposits.size` entries.
 */
export function buildJets(deposits: DepositList, radius: number, jets: DepositList, order: Int32Array): void {
  jets.clear();
  const n = deposits.size;
  // Indices in decreasing pT (insertion sort: a parton-level event has few deposits).
  for (let i = 0; i < n; i++) {
    let j = i;
    const pt = deposits.pt[i]!;
    while (j > 0 && deposits.pt[order[j - 1]!]! < pt) {
      order[j] = order[j - 1]!;
      j--;
    }
    order[j] = i;
  }
  const radius2 = radius * radius;
  for (let k = 0; k < n; k++) {
    const d = order[k]!;
    const eta = deposits.eta[d]!;
    const phi = deposits.phi[d]!;
    let target = -1;
    if (radius2 > 0) {
      // Seed axes are the eta and phi the jet had when it was seeded; jets.eta/phi
      // are only updated after clustering, so they still hold the seeds here.
      for (let j = 0; j < jets.size; j++) {
        const dEta = eta - jets.eta[j]!;
        let dPhi = Math.abs(phi - jets.phi[j]!);
        if (dPhi > Math.PI) dPhi = TWO_PI - dPhi;
        if (dEta * dEta + dPhi * dPhi < radius2) {
          target = j;
          break;
        }
      }
    }
    if (target < 0) {
      jets.add(deposits.px[d]!, deposits.py[d]!, deposits.pz[d]!, deposits.e[d]!, deposits.pt[d]!, eta, phi, deposits.flavour[d]!, deposits.truthId[d]!);
    } else {
      jets.addMomentum(target, deposits.px[d]!, deposits.py[d]!, deposits.pz[d]!, deposits.e[d]!);
      if (deposits.flavour[d]! > jets.flavour[target]!) {
        jets.flavour[target] = deposits.flavour[d]!;
        jets.truthId[target] = deposits.truthId[d]!;
      }
      // Mark the jet as merged (pT < 0) so its kinematics are recomputed below.
      jets.pt[target] = -1;
    }
  }
  for (let j = 0; j < jets.size; j++) if (jets.pt[j]! < 0) jets.updateAngles(j);
}
