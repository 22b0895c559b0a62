/**
 * The detector-profile file format (`analyses/detectors/*.yaml`), defined once
 * in zod: the loader validates against it and `npm run schemas` writes
 * shared/detector.schema.json from it. Keys are tamis's own snake_case words.
 * Checks the schema cannot express (increasing edges, table shapes, acceptance
 * limits) live in ./profileChecks.ts.
 */
import { z } from 'zod';

const probability = z.number().min(0).max(1);
const ptEdge = z.number().min(0).max(100_000);
const absEta = z.number().min(0).max(10);

const ptEdges = z.array(ptEdge).min(2).max(65).describe('transverse-momentum bin edges in GeV, strictly increasing; below the first edge the probability is 0, above the last edge the last bin applies');
const absEtaEdges = z.array(absEta).min(2).max(65).describe('|pseudorapidity| bin edges, strictly increasing');

/** A probability in bins of pT (rows) and |eta| (columns). */
export const EfficiencyTableSchema = z
  .strictObject({
    pt_edges: ptEdges,
    abs_eta_edges: absEtaEdges.describe('|pseudorapidity| bin edges, strictly increasing; outside them the probability is 0'),
    values: z.array(z.array(probability).min(1).max(64)).min(1).max(64).describe('one row per pT bin, one column per |eta| bin, each a probability in [0, 1]'),
  })
  .describe('probability tabulated in pT and |eta| bins');

/** A probability in |eta| bins only (charge-flip rates). */
export const EtaValuesSchema = z
  .strictObject({
    abs_eta_edges: absEtaEdges.describe('|pseudorapidity| bin edges starting at 0, strictly increasing; beyond the last edge the last bin applies'),
    values: z.array(probability).min(1).max(64).describe('one probability per |eta| bin'),
  })
  .describe('probability tabulated in |eta| bins');

const resolutionTerm = (max: number, what: string) => z.array(z.number().min(0).max(max)).min(1).max(64).optional().describe(`${what}, one value per |eta| bin (absent: 0 everywhere)`);

/** Relative resolution sigma_X/X = sqrt((noise/X)^2 + stochastic^2/X + constant^2 + (linear X)^2), X in GeV. */
export const ResolutionSchema = z
  .strictObject({
    measured: z.enum(['energy', 'pt']).describe('the quantity X that is smeared: the energy (calorimeter) or the transverse momentum (tracker)'),
    abs_eta_edges: absEtaEdges.describe('|pseudorapidity| bin edges starting at 0; beyond the last edge the last bin applies'),
    noise: resolutionTerm(10_000, 'noise term in GeV (sigma contribution independent of X)'),
    stochastic: resolutionTerm(100, 'stochastic term in GeV^(1/2): 1.0 means 100%/sqrt(X)'),
    constant: resolutionTerm(10, 'constant relative term: 0.05 means 5%'),
    linear: resolutionTerm(1, 'relative term growing linearly with X, in 1/GeV: 1e-4 means 10% at 1 TeV'),
  })
  .describe('relative resolution sigma_X/X = sqrt((noise/X)^2 + stochastic^2/X + constant^2 + (linear X)^2), X in GeV');

const LeptonShape = {
  efficiency: EfficiencyTableSchema.describe('reconstruction and identification efficiency'),
  resolution: ResolutionSchema,
  charge_flip: EtaValuesSchema.describe('probability that the reconstructed charge has the wrong sign'),
};

export const ChargedLeptonSchema = z.strictObject(LeptonShape).describe('response to a prompt charged lepton');

export const TauSchema = z
  .strictObject({
    ...LeptonShape,
    efficiency: EfficiencyTableSchema.describe('identification efficiency of the visible hadronic system of a tau, in its visible pT'),
    jet_fake_rate: EfficiencyTableSchema.describe('probability that a quark or gluon jet is identified as a hadronic tau'),
  })
  .describe('response to hadronically decaying taus');

export const JetSchema = z
  .strictObject({
    min_pt: z.number().gt(0).max(10_000).describe('jets below this smeared pT (GeV) are not reconstructed; their momentum goes into the soft term'),
    abs_eta_max: absEta.describe('jets beyond this |eta| are not reconstructed; their momentum goes into the soft term'),
    radius: z.number().min(0).max(2).describe('partons closer than this Delta R to a harder jet axis are merged into that jet (0: no merging)'),
    resolution: ResolutionSchema.describe('jet energy resolution'),
    response_tail: z
      .strictObject({
        fraction: probability.describe('fraction of jets measured with a wider Gaussian'),
        width_factor: z.number().min(1).max(100).describe('width of the tail Gaussian relative to the core resolution'),
      })
      .optional()
      .describe('non-Gaussian tail of the jet response (absent: none)'),
  })
  .describe('jets from quarks, gluons and unidentified calorimeter deposits');

export const BTaggingSchema = z
  .strictObject({
    b_efficiency: EfficiencyTableSchema.describe('probability to tag a jet containing a b quark'),
    c_mistag: EfficiencyTableSchema.describe('probability to tag a jet containing a c quark (and no b)'),
    light_mistag: EfficiencyTableSchema.describe('probability to tag a light-quark or gluon jet'),
    tau_mistag: EfficiencyTableSchema.describe('probability to tag a jet from an unidentified hadronic tau'),
  })
  .describe('b-tagging efficiency and mistag rates in the jet pT and |eta|');

export const MissingMomentumSchema = z
  .strictObject({
    soft_term_constant: z.number().min(0).max(10_000).describe('resolution per transverse component of the soft term from activity the event record lacks (pile-up, underlying event), GeV'),
    soft_term_stochastic: z.number().min(0).max(100).describe('resolution per component growing as this times sqrt(sum of pT of the unclustered visible particles in GeV), GeV^(1/2)'),
  })
  .describe('missing transverse momentum: sigma per component = sqrt(soft_term_constant^2 + soft_term_stochastic^2 * soft sum pT)');

export const DetectorProfileSchema = z
  .strictObject({
    name: z
      .string()
      .min(1)
      .max(64)
      .regex(/^[a-z0-9][a-z0-9._-]*$/, 'a name of lower-case letters, digits, ".", "_" and "-"')
      .describe('short name used by analysis files to refer to this profile'),
    summary: z.string().min(1).max(400).describe('one line: what this profile represents'),
    collider_energy_tev: z.number().gt(0).max(1000).describe('centre-of-mass energy of the era this profile describes, TeV'),
    acceptance: z
      .strictObject({
        tracker_abs_eta: absEta.describe('|eta| coverage of the tracker: electrons, muons, taus and b-tagging need it'),
        calorimeter_abs_eta: absEta.describe('|eta| coverage of the calorimeters: visible particles beyond it are lost'),
      })
      .describe('geometric coverage'),
    electrons: ChargedLeptonSchema,
    muons: ChargedLeptonSchema,
    taus: TauSchema,
    jets: JetSchema,
    b_tagging: BTaggingSchema,
    missing_momentum: MissingMomentumSchema,
  })
  .describe('a parametrised detector response for one collider era (typical values of the trade)');

/** A detector profile as written in its file (before resolution into lookup tables). */
export type DetectorProfileFile = z.output<typeof DetectorProfileSchema>;
export type EfficiencyTableFile = z.output<typeof EfficiencyTableSchema>;
export type EtaValuesFile = z.output<typeof EtaValuesSchema>;
export type ResolutionFile = z.output<typeof ResolutionSchema>;
