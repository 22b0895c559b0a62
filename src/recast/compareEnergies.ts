/**
 * The energy comparison: one model through the analyses of each collider
 * energy, efficiencies side by side per analysis and per region, with what
 * each cut costs: the view that shows why a search with a missing-momentum
 * requirement misses a signal with no invisible particle. No limits are
 * computed (see `recastPoint` for those).
 */
import type { Analysis } from '../selection/analysis.js';
import { signalRegionEfficiency } from './analysisOutcome.js';
import type { RequirementCost } from './requirementCosts.js';
import { selectPoint, type RecastOptions } from './recastPoint.js';
import type { EnergyCrossSection } from './types.js';

export interface RegionEfficiency {
  name: string;
  efficiency: number;
  efficiencyError: number;
  selectedEvents: number;
}

export interface AnalysisEfficiency {
  id: string;
  summary: string;
  energyTeV: number;
  luminosityIfb: number;
  crossSectionPb: number;
  /** Efficiency of the signal regions as a whole (union when disjoint, else the best region). */
  signalRegionEfficiency: { value: number; error: number };
  /** Expected signal events in the signal regions: sigma x luminosity x efficiency. */
  signalEvents: number;
  /** Efficiency after each selection step. */
  steps: { name: string; cut: string; efficiency: number }[];
  regions: RegionEfficiency[];
  /** What dropping every condition on one variable would give the signal regions, costliest first. */
  requirementCosts: RequirementCost[];
}

export interface EnergyComparison {
  modelName: string;
  events: number;
  seed: number;
  energies: EnergyCrossSection[];
  analyses: AnalysisEfficiency[];
}

export type CompareOptions = Omit<RecastOptions, 'cl' | 'method' | 'combinationMethod' | 'uncertaintyModel'> & { analyses: readonly Analysis[] };

export async function compareEnergies(options: CompareOptions): Promise<EnergyComparison> {
  const point = await selectPoint({ ...options, requirementCosts: true });
  return {
    modelName: point.modelName,
    events: options.events,
    seed: options.seed,
    energies: point.energies,
    analyses: point.selections.map(({ analysis, selected, crossSectionPb, requirementCosts }) => {
      const inRegions = signalRegionEfficiency(selected);
      return {
        id: analysis.id,
        summary: analysis.summary,
        energyTeV: analysis.energyTev,
        luminosityIfb: analysis.luminosityIfb,
        crossSectionPb,
        signalRegionEfficiency: inRegions,
        // sigma [pb] x L [fb^-1] x 1000 pb^-1 per fb^-1 x efficiency
        signalEvents: crossSectionPb * analysis.luminosityIfb * 1000 * inRegions.value,
        steps: selected.steps.map((s) => ({ name: s.name, cut: s.cut, efficiency: s.efficiency })),
        regions: selected.regions.map((r) => ({ name: r.name, efficiency: r.efficiency, efficiencyError: r.efficiencyError, selectedEvents: r.events })),
        requirementCosts,
      };
    }),
  };
}
