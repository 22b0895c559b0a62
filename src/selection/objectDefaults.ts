/**
 * Defaults of the object definitions, used where an analysis file leaves a
 * key out. Values typical of multi-lepton searches at 8 and 13 TeV (common
 * practice); analyses/README.md lists them.
 */
import type { AnalysisFile } from './schema.js';
import type { ObjectDefinitions } from './objects.js';

export const OBJECT_DEFAULTS: ObjectDefinitions = {
  electrons: { minPt: 10, maxAbsEta: 2.5, maxRelativeIsolation: Infinity },
  muons: { minPt: 10, maxAbsEta: 2.5, maxRelativeIsolation: Infinity },
  taus: { minPt: 20, maxAbsEta: 2.5 },
  jets: { minPt: 30, maxAbsEta: 2.5 },
  bJets: { minPt: 30, maxAbsEta: 2.5 },
  isolationCone: 0.3,
  overlapRemoval: { tausNearLeptons: 0.2, jetsNearLeptons: 0.2, jetsNearTaus: 0.2, leptonsNearJets: 0.4 },
};

/** The object definitions of a file with every omitted key set to its default. */
export function resolveObjects(written: AnalysisFile['objects']): ObjectDefinitions {
  const d = OBJECT_DEFAULTS;
  const w = written ?? {};
  const or = w.overlap_removal ?? {};
  return {
    electrons: {
      minPt: w.electrons?.min_pt ?? d.electrons.minPt,
      maxAbsEta: w.electrons?.max_abs_eta ?? d.electrons.maxAbsEta,
      maxRelativeIsolation: w.electrons?.max_relative_isolation ?? d.electrons.maxRelativeIsolation,
    },
    muons: {
      minPt: w.muons?.min_pt ?? d.muons.minPt,
      maxAbsEta: w.muons?.max_abs_eta ?? d.muons.maxAbsEta,
      maxRelativeIsolation: w.muons?.max_relative_isolation ?? d.muons.maxRelativeIsolation,
    },
    taus: { minPt: w.taus?.min_pt ?? d.taus.minPt, maxAbsEta: w.taus?.max_abs_eta ?? d.taus.maxAbsEta },
    jets: { minPt: w.jets?.min_pt ?? d.jets.minPt, maxAbsEta: w.jets?.max_abs_eta ?? d.jets.maxAbsEta },
    bJets: { minPt: w.b_jets?.min_pt ?? d.bJets.minPt, maxAbsEta: w.b_jets?.max_abs_eta ?? d.bJets.maxAbsEta },
    isolationCone: w.isolation_cone ?? d.isolationCone,
    overlapRemoval: {
      tausNearLeptons: or.taus_near_leptons ?? d.overlapRemoval.tausNearLeptons,
      jetsNearLeptons: or.jets_near_leptons ?? d.overlapRemoval.jetsNearLeptons,
      jetsNearTaus: or.jets_near_taus ?? d.overlapRemoval.jetsNearTaus,
      leptonsNearJets: or.leptons_near_jets ?? d.overlapRemoval.leptonsNearJets,
    },
  };
}
