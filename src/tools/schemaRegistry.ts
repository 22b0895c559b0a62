/**
 * The YAML formats whose JSON Schemas live in the project's `shared/` folder.
 * Each entry gives the file name and a loader for its zod schema; add a line
 * when a new format appears. `npm run schemas` writes them; a test checks that
 * the committed files are up to date.
 */
import type { z } from 'zod';

export interface SchemaEntry {
  /** File name under shared/, e.g. `model.schema.json`. */
  file: string;
  title: string;
  description: string;
  load: () => Promise<z.ZodType>;
}

export const SCHEMAS: readonly SchemaEntry[] = [
  { file: 'analysis.schema.json', title: 'tamis analysis', description: 'A search re-implemented for tamis: objects, selection steps, signal regions with published yields (analyses/*.yaml; format in analyses/README.md).', load: async () => (await import('../selection/schema.js')).AnalysisFileSchema },
  { file: 'detector.schema.json', title: 'tamis detector profile', description: 'A parametrised detector response for one collider era (analyses/detectors/*.yaml).', load: async () => (await import('../detector/profile/schema.js')).DetectorProfileSchema },
  { file: 'scan.schema.json', title: 'tamis scan', description: 'A grid of model points for tamis scan: base model, one or two axes, derived parameters, energies, analyses, events and seed (*.scan.yaml).', load: async () => (await import('../recast/scan/schema.js')).ScanFileSchema },
  { file: 'model.schema.json', title: 'tamis model', description: 'A new-physics model point for tamis: new particles, heavy vector resonances, production channels and decay tables (*.model.yaml).', load: async () => (await import('../generator/model/schema.js')).modelFileSchema },
];
