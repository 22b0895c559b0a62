/**
 * The scan file (`*.scan.yaml`): a base model, one or two grid axes that set
 * model parameters, derived parameters given by formulas, the energies,
 * analyses, events per point, seed and limit settings. Paths are relative to
 * the scan file.
 */
import { z } from 'zod';

const parameterName = z
  .string()
  .regex(/^[A-Za-z_][A-Za-z0-9_]*$/, 'a parameter name is a letter or underscore followed by letters, digits or underscores')
  .describe('Name of the parameter, used in formulas and as a column of scan.csv.');

const modelPath = z
  .string()
  .min(1)
  .describe('Where the value goes in the model file: dot-separated keys, a list entry picked by its name (particles.S+.mass, resonances.V0.mass, channels.charged_pair.k_factor) or by its position (decays.S+.modes.0.branching).');

const range = z.strictObject({
  from: z.number().describe('First value.'),
  to: z.number().describe('Last value (included).'),
  points: z.number().int().min(2).max(10_000).describe('Number of evenly spaced values from `from` to `to`.'),
});

const axis = z
  .strictObject({
    name: parameterName,
    set: z.array(modelPath).min(1).describe('Model values this parameter sets (one or more paths).'),
    values: z.array(z.number()).min(1).max(10_000).optional().describe('The values of the parameter.'),
    range: range.optional().describe('Evenly spaced values, instead of `values`.'),
    unit: z.string().max(20).default('GeV').describe('Unit shown in tables and plots.'),
  })
  .describe('One grid axis.');

const derived = z.strictObject({
  set: z.array(modelPath).min(1).describe('Model values this formula sets.'),
  formula: z.string().min(1).describe('Arithmetic formula of the axes and constants: + - * / ^, parentheses, sqrt exp log abs min max.'),
});

const limits = z.strictObject({
  cl: z.number().gt(0.5).lt(1).default(0.95).describe('Confidence level.'),
  method: z.enum(['exact', 'toys', 'asymptotic', 'auto']).default('auto').describe('CLs method for the regions.'),
  combination_method: z
    .enum(['exact', 'toys', 'asymptotic', 'auto'])
    .optional()
    .describe('CLs method for the combination of an analysis\'s regions (default: method). asymptotic keeps large scans fast.'),
  uncertainty_model: z.enum(['lognormal', 'gaussian']).default('lognormal').describe('Shape of the background uncertainty.'),
});

export const ScanFileSchema = z.strictObject({
  name: z.string().min(1).max(80).describe('Short name of the scan, used in reports.'),
  description: z.string().optional(),
  model: z.string().min(1).describe('Base model file, relative to the scan file.'),
  analyses: z.array(z.string().min(1)).min(1).describe('Analysis files or folders, relative to the scan file.'),
  energies: z.array(z.number().gt(0).max(100)).min(1).optional().describe('Collider energies in TeV (default: every energy of the analyses).'),
  events: z.number().int().min(100).max(100_000_000).default(20_000).describe('Generated events per point and energy.'),
  seed: z.number().int().min(0).max(Number.MAX_SAFE_INTEGER).default(1).describe('Seed of every random stream of the scan.'),
  precision: z.number().min(1e-4).max(0.2).default(0.01).describe('Target relative MC error of each cross section.'),
  constants: z.record(parameterName, z.number()).default({}).describe('Named numbers for formulas.'),
  parameters: z.array(axis).min(1).max(2).describe('One or two grid axes; the first is the mass axis of the limit plots.'),
  derived: z.array(derived).default([]).describe('Model values computed from the axes and constants.'),
  limits: limits.default({ cl: 0.95, method: 'auto', uncertainty_model: 'lognormal' }),
});

export type ScanFile = z.output<typeof ScanFileSchema>;
