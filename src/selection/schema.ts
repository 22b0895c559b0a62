/**
 * The analysis file format, as written by users (zod; the JSON Schema in
 * shared/analysis.schema.json is generated from it). Defaults are not
 * filled in here: `loader.ts` resolves what was written into an `Analysis`.
 * Key names are tamis's own; analyses/README.md documents each one.
 */
import { z } from 'zod';

const positive = (what: string) => z.number().positive().describe(what);
const cone = (what: string) => z.number().min(0).max(10).describe(`${what} (Delta R; 0 switches the step off)`);

const Thresholds = {
  min_pt: z.number().min(0).describe('minimum transverse momentum, GeV').optional(),
  max_abs_eta: positive('maximum |pseudorapidity|').optional(),
};

export const LeptonObjectSchema = z.strictObject({
  ...Thresholds,
  max_relative_isolation: z.number().min(0).describe('maximum relative isolation (cone pT sum / lepton pT); omit for no isolation').optional(),
});

export const ObjectSchema = z.strictObject(Thresholds);

export const ObjectsSchema = z
  .strictObject({
    electrons: LeptonObjectSchema.optional(),
    muons: LeptonObjectSchema.optional(),
    taus: ObjectSchema.optional().describe('hadronically decaying tau candidates'),
    jets: ObjectSchema.optional(),
    b_jets: ObjectSchema.optional().describe('thresholds a selected b-tagged jet must also pass to count as a b-jet'),
    isolation_cone: z.number().positive().max(2).describe('Delta R cone of the lepton isolation sum').optional(),
    overlap_removal: z
      .strictObject({
        taus_near_leptons: cone('remove taus within this distance of a lepton').optional(),
        jets_near_leptons: cone('remove jets within this distance of a lepton').optional(),
        jets_near_taus: cone('remove jets within this distance of a tau').optional(),
        leptons_near_jets: cone('remove leptons within this distance of a remaining jet').optional(),
      })
      .optional(),
  })
  .describe('object definitions; every key is optional and has a documented default');

export const StepSchema = z.strictObject({
  name: z.string().min(1).describe('row label of the cut-flow'),
  cut: z.string().describe('cut expression'),
});

const regionName = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9_.+-]*$/, 'region names use letters, digits and _ . + - (no spaces)')
  .describe('unique region name');

export const RegionSchema = z.strictObject({
  name: regionName,
  cuts: z.array(z.string()).min(1).describe('cut expressions, all required (applied after the steps)'),
  observed: z.number().int().min(0).describe('observed event count'),
  background: z.number().min(0).describe('expected Standard-Model background, events'),
  background_uncertainty: z.number().min(0).describe('total (statistical and systematic) uncertainty of the background, events'),
  n95_observed: positive('published 95% CL upper limit on signal events (observed), for cross-checks').optional(),
  n95_expected: positive('published 95% CL upper limit on signal events (expected), for cross-checks').optional(),
});

export const CorrelationGroupSchema = z.strictObject({
  name: z.string().min(1),
  regions: z.array(z.string()).min(2).describe('regions whose background uncertainties are fully correlated'),
});

export const ReferenceCutflowSchema = z.strictObject({
  model: z.string().min(1).describe('benchmark model file, relative to this analysis file'),
  source: z.string().min(1).describe('where the numbers come from'),
  events_before_cuts: positive('expected signal events before any cut (cross section times luminosity)'),
  steps: z
    .array(z.strictObject({ step: z.string().min(1), events: z.number().min(0) }))
    .min(1)
    .describe('expected signal events after each step, in step order'),
  regions: z.array(z.strictObject({ region: z.string().min(1), events: z.number().min(0) })).optional(),
});

export const AnalysisFileSchema = z.strictObject({
  id: z
    .string()
    .regex(/^[a-z0-9][a-z0-9_-]*$/, 'ids use lower-case letters, digits, _ and - (no spaces)')
    .max(80)
    .describe('short unique identifier, e.g. three-lepton-8tev'),
  summary: z.string().min(1).describe('one line saying what the search selects'),
  invented: z.boolean().describe('true for demo analyses whose numbers are invented').optional(),
  reference: z.string().min(1).describe('the publication re-implemented (arXiv number)').optional(),
  energy_tev: z.number().positive().max(1000).describe('proton-proton centre-of-mass energy, TeV'),
  luminosity_ifb: z.number().positive().max(1e6).describe('integrated luminosity, fb^-1'),
  detector: z.string().min(1).describe('detector profile file, relative to this analysis file'),
  objects: ObjectsSchema.optional(),
  steps: z.array(StepSchema).describe('ordered selection steps: the cut-flow').optional(),
  regions_disjoint: z.boolean().describe('whether the regions are meant to share no event (default true); checked on every sample').optional(),
  regions: z.array(RegionSchema).min(1),
  correlation_groups: z.array(CorrelationGroupSchema).optional(),
  reference_cutflow: ReferenceCutflowSchema.optional(),
});

/** An analysis file as written. */
export type AnalysisFile = z.output<typeof AnalysisFileSchema>;
