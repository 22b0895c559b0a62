/**
 * THE table of event variables that cut expressions may use.
 *
 * Each entry: name (what users write), unit, one-line definition, and the
 * function computing it from the analysis-level objects. The documentation
 * table in analyses/README.md and `tamis variables` are generated from this
 * list; a test fails when the README is stale. "Leptons" are the selected
 * electrons and muons; hadronic taus are counted separately.
 */
import type { AnalysisObjects } from './objects.js';
import { findZCandidate, minimumPairMass, threeLeptonMass } from './pairs.js';

export interface VariableDefinition {
  name: string;
  /** `GeV`, `count` or `e` (charge in units of the positron charge). */
  unit: 'GeV' | 'count' | 'e';
  /** The definition printed in the documentation. */
  description: string;
  /**
   * Writes the variable's value for the current event into `out[slot]`.
   * (Writing instead of returning keeps the hot loop free of allocation: a
   * floating-point value returned through the table's many-target call would
   * be boxed by the JavaScript engine.)
   */
  compute(o: AnalysisObjects, out: Float64Array, slot: number): void;
}

function sumPt(pt: Float64Array, size: number): number {
  let s = 0;
  for (let i = 0; i < size; i++) s += pt[i]!;
  return s;
}

function countCharge(o: AnalysisObjects, flavour: number, sign: number): number {
  let n = 0;
  const l = o.leptons;
  for (let i = 0; i < l.size; i++) if ((flavour === 0 || l.label[i] === flavour) && l.charge[i] === sign) n++;
  return n;
}

/** The lepton paired with the missing momentum in `mt`: the one outside the Z candidate, else the leading one. */
function wLepton(o: AnalysisObjects): number {
  if (o.leptons.size === 0) return -1;
  findZCandidate(o);
  if (o.zFirst < 0) return 0;
  for (let i = 0; i < o.leptons.size; i++) if (i !== o.zFirst && i !== o.zSecond) return i;
  return 0;
}

const nthPt =
  (list: 'leptons' | 'taus', n: number) =>
  (o: AnalysisObjects, out: Float64Array, slot: number): void => {
    out[slot] = o[list].size > n ? o[list].pt[n]! : 0;
  };

export const VARIABLES: readonly VariableDefinition[] = [
  { name: 'n_leptons', unit: 'count', description: 'selected light leptons (electrons and muons)', compute: (o, out, s) => { out[s] = o.leptons.size; } },
  { name: 'n_electrons', unit: 'count', description: 'selected electrons', compute: (o, out, s) => { out[s] = o.nElectrons; } },
  { name: 'n_muons', unit: 'count', description: 'selected muons', compute: (o, out, s) => { out[s] = o.nMuons; } },
  { name: 'n_taus', unit: 'count', description: 'selected hadronically decaying tau candidates', compute: (o, out, s) => { out[s] = o.taus.size; } },
  { name: 'n_leptons_plus_taus', unit: 'count', description: 'n_leptons + n_taus', compute: (o, out, s) => { out[s] = o.leptons.size + o.taus.size; } },
  { name: 'n_jets', unit: 'count', description: 'selected jets, b-tagged ones included', compute: (o, out, s) => { out[s] = o.nJets; } },
  { name: 'n_bjets', unit: 'count', description: 'selected jets that are b-tagged and pass the b-jet thresholds', compute: (o, out, s) => { out[s] = o.nBJets; } },
  {
    name: 'n_sfos',
    unit: 'count',
    description: 'largest number of disjoint same-flavour opposite-sign lepton pairs, min(n e+, n e-) + min(n mu+, n mu-): 1 for e+ e- mu+, 1 for e+ e- e+, 2 for e+ e- mu+ mu-',
    compute: (o, out, s) => {
      out[s] = Math.min(countCharge(o, 11, 1), countCharge(o, 11, -1)) + Math.min(countCharge(o, 13, 1), countCharge(o, 13, -1));
    },
  },
  {
    name: 'n_ss_pairs',
    unit: 'count',
    description: 'lepton pairs with equal charges, any flavours: C(n+, 2) + C(n-, 2)',
    compute: (o, out, s) => {
      const plus = countCharge(o, 0, 1);
      const minus = countCharge(o, 0, -1);
      out[s] = (plus * (plus - 1)) / 2 + (minus * (minus - 1)) / 2;
    },
  },
  {
    name: 'total_charge',
    unit: 'e',
    description: 'sum of the lepton charges',
    compute: (o, out, s) => {
      let q = 0;
      for (let i = 0; i < o.leptons.size; i++) q += o.leptons.charge[i]!;
      out[s] = q;
    },
  },
  {
    name: 'mll_z',
    unit: 'GeV',
    description: 'mass of the same-flavour opposite-sign lepton pair nearest M_Z = 91.188 GeV; 0 without such a pair',
    compute: (o, out, s) => {
      findZCandidate(o);
      out[s] = o.zMass;
    },
  },
  { name: 'min_mll_sfos', unit: 'GeV', description: 'smallest same-flavour opposite-sign lepton-pair mass; 0 without such a pair', compute: (o, out, s) => { out[s] = minimumPairMass(o, true); } },
  { name: 'min_mll', unit: 'GeV', description: 'smallest lepton-pair mass over all pairs; 0 with fewer than two leptons', compute: (o, out, s) => { out[s] = minimumPairMass(o, false); } },
  { name: 'mlll', unit: 'GeV', description: 'invariant mass of the three leading leptons; 0 with fewer than three', compute: (o, out, s) => { out[s] = threeLeptonMass(o); } },
  { name: 'met', unit: 'GeV', description: 'magnitude of the missing transverse momentum', compute: (o, out, s) => { out[s] = o.met; } },
  { name: 'ht', unit: 'GeV', description: 'scalar sum of the pT of the selected jets', compute: (o, out, s) => { out[s] = o.ht; } },
  { name: 'lt', unit: 'GeV', description: 'scalar sum of the pT of the selected leptons and taus', compute: (o, out, s) => { out[s] = sumPt(o.leptons.pt, o.leptons.size) + sumPt(o.taus.pt, o.taus.size); } },
  { name: 'meff', unit: 'GeV', description: 'effective mass ht + lt + met', compute: (o, out, s) => { out[s] = o.ht + sumPt(o.leptons.pt, o.leptons.size) + sumPt(o.taus.pt, o.taus.size) + o.met; } },
  {
    name: 'mt',
    unit: 'GeV',
    description: 'transverse mass sqrt(2 pT met (1 - cos dphi)) of the missing momentum and one lepton: the leading lepton outside the mll_z pair if there is one, else the leading lepton; 0 without leptons',
    compute: (o, out, s) => {
      const i = wLepton(o);
      // mT^2 = 2 (pT met - pT . met) = 2 pT met (1 - cos dphi), without computing angles.
      const m = o.leptons.momentum;
      const v = i < 0 ? 0 : 2 * (o.leptons.pt[i]! * o.met - (m[4 * i]! * o.metX + m[4 * i + 1]! * o.metY));
      out[s] = v > 0 ? Math.sqrt(v) : 0;
    },
  },
  { name: 'lep1_pt', unit: 'GeV', description: 'pT of the leading lepton; 0 if absent', compute: nthPt('leptons', 0) },
  { name: 'lep2_pt', unit: 'GeV', description: 'pT of the second lepton; 0 if absent', compute: nthPt('leptons', 1) },
  { name: 'lep3_pt', unit: 'GeV', description: 'pT of the third lepton; 0 if absent', compute: nthPt('leptons', 2) },
  { name: 'tau1_pt', unit: 'GeV', description: 'pT of the leading tau; 0 if absent', compute: nthPt('taus', 0) },
  { name: 'jet1_pt', unit: 'GeV', description: 'pT of the leading jet; 0 if absent', compute: (o, out, s) => { out[s] = o.leadingJetPt; } },
];

const SLOTS: ReadonlyMap<string, number> = new Map(VARIABLES.map((v, i) => [v.name, i]));

/** Slot (index in `VARIABLES`) of a variable, or -1 when the name is unknown. */
export function variableSlot(name: string): number {
  return SLOTS.get(name) ?? -1;
}

/** Names of all variables, in table order. */
export function variableNames(): string[] {
  return VARIABLES.map((v) => v.name);
}
