/**
 * The model file format (`*.model.yaml`): what the user writes, as a zod schema.
 * The JSON Schema in shared/model.schema.json is generated from it
 * (`npm run schemas`). Checks the schema cannot express (names that must
 * exist, charge conservation, thresholds, branching sums) live in the
 * resolver, which reports them at the offending line.
 *
 * Bounds: masses up to 100 TeV, couplings up to 4 pi in magnitude (beyond that
 * a tree-level treatment is meaningless: the perturbative bound is common practice).
 */
import { z } from 'zod';
import { ELECTROWEAK_SCHEMES } from '../electroweak.js';

/** Largest mass accepted anywhere in a model file, GeV. */
export const MAX_MASS_GEV = 1e5;
/** Largest magnitude of a coupling (4 pi: perturbativity, common practice). */
export const MAX_COUPLING = 4 * Math.PI;

const particleName = z
  .string()
  .min(1)
  .max(40)
  .regex(/^[A-Za-z][A-Za-z0-9_+\-~'.]*$/, 'a name starts with a letter and uses letters, digits and + - _ ~ \' .')
  .describe('Name used in channels and decay tables, e.g. "S+".');

const mass = z
  .union([
    z.number().positive().max(MAX_MASS_GEV),
    z.strictObject({
      ratio: z.number().positive().max(1000).describe('Mass = ratio x the mass of `of`.'),
      of: particleName.describe('Name of the new particle or resonance whose mass is scaled.'),
    }),
  ])
  .describe('Pole mass in GeV, or {ratio, of}: a fixed ratio to another new state\'s mass (a scan varies one mass and the ratio).');

const coupling = z.number().min(-MAX_COUPLING).max(MAX_COUPLING);

const chiralCouplings = z.strictObject({
  left: coupling.default(0).describe('Coupling to the left-handed current, vertex -i gamma^mu (left P_L + right P_R).'),
  right: coupling.default(0).describe('Coupling to the right-handed current.'),
});

const newParticle = z.strictObject({
  name: particleName,
  anti_name: particleName
    .optional()
    .describe('Name of the antiparticle. Default: a final "+" becomes "-" and vice versa, otherwise "bar" is appended.'),
  id: z.number().int().min(1).max(2147483647).describe('PDG-style positive id of the particle; the antiparticle is -id.'),
  spin: z.union([z.literal(0), z.literal(0.5)]).describe('0: complex scalar; 0.5: Dirac fermion. New particles are colour singlets.'),
  mass,
  charge: z.number().min(-10).max(10).describe('Electric charge in units of e.'),
  weak_isospin: z
    .number()
    .min(-5)
    .max(5)
    .optional()
    .describe('T3 of the scalar, or of the left-handed fermion. Gives the Z coupling T3 - Q sin^2 theta_W.'),
  weak_isospin_right: z
    .number()
    .min(-5)
    .max(5)
    .optional()
    .describe('Fermions only: T3 of the right-handed component. Default: equal to weak_isospin (vector-like fermion).'),
  hypercharge: z.number().min(-10).max(10).optional().describe('Optional check: charge must equal weak_isospin + hypercharge.'),
  z_couplings: z
    .strictObject({
      vector: coupling.optional().describe('Fermions: g_V of the vertex -i (g_Z/2) gamma^mu (g_V - g_A gamma^5).'),
      axial: coupling.optional().describe('Fermions: g_A of the same vertex.'),
      scalar: coupling.optional().describe('Scalars: g_S of the vertex -i g_Z g_S (k1 - k2)^mu.'),
    })
    .optional()
    .describe('Explicit Z couplings instead of weak_isospin, in units of g_Z = e / (sin theta_W cos theta_W).'),
  width: z.number().min(0).max(MAX_MASS_GEV).default(0).describe('Total width in GeV (0: narrow).'),
});

const pairCoupling = z.strictObject({
  pair: z.tuple([particleName, particleName]).describe('The pair the resonance couples to, e.g. [S+, S-].'),
  coupling: coupling.optional().describe('Scalar pair: g of the vertex -i g (k1 - k2)^mu.'),
  left: coupling.optional().describe('Fermion pair: left-handed coupling.'),
  right: coupling.optional().describe('Fermion pair: right-handed coupling.'),
});

const resonance = z.strictObject({
  name: particleName,
  id: z.number().int().min(1).max(2147483647).describe('PDG-style positive id (written to event files only if the resonance appears there).'),
  charge: z.union([z.literal(0), z.literal(1)]).describe('0: neutral resonance; 1: charged resonance (its conjugate is implied).'),
  mass,
  width: z
    .union([z.number().positive().max(MAX_MASS_GEV), z.literal('auto')])
    .default('auto')
    .describe('Total width in GeV, or "auto": the sum of the tree-level partial widths into the channels below.'),
  quark_couplings: chiralCouplings.describe('Flavour-universal couplings to quark currents (charged resonances: times the CKM element).'),
  lepton_couplings: z
    .strictObject({
      left: coupling.default(0),
      right: coupling.default(0),
      neutrino: coupling.optional().describe('Neutral resonances: coupling to left-handed neutrinos. Default: equal to left.'),
    })
    .optional()
    .describe('Optional flavour-universal couplings to lepton currents (dilepton searches).'),
  pair_couplings: z.array(pairCoupling).default([]).describe('Couplings to pairs of new particles.'),
});

const particleRef = z.union([particleName, z.number().int()]);

const channel = z.strictObject({
  name: z
    .string()
    .min(1)
    .max(60)
    .regex(/^[A-Za-z0-9_.\-+]+$/, 'a channel name uses letters, digits and _ . - +'),
  pair: z.tuple([particleRef, particleRef]).describe('The produced pair, by name or PDG id; charge-conjugate states are included.'),
  through: z
    .array(z.string().min(1))
    .min(1)
    .describe('s-channel vectors: photon, Z, W, or resonance names. All amplitudes interfere.'),
  k_factor: z.number().positive().max(100).default(1).describe('Multiplies the leading-order cross section (printed beside it).'),
  w_coupling: z
    .union([coupling, z.strictObject({ left: coupling.default(0), right: coupling.default(0) })])
    .optional()
    .describe('W coupling to the pair in units of g/sqrt(2): a number for scalars, {left, right} for fermions. Default: 1 (doublet).'),
  mass_range: z
    .tuple([z.number().min(0).max(MAX_MASS_GEV), z.number().positive().max(MAX_MASS_GEV)])
    .optional()
    .describe('Window on the pair invariant mass in GeV. Required for pairs lighter than 10 GeV.'),
  scale: z
    .union([z.enum(['average_mass', 'pair_mass']), z.number().positive().max(MAX_MASS_GEV)])
    .optional()
    .describe('mu_F = mu_R: average_mass (default for new particles), pair_mass (default for lepton pairs) or a number in GeV.'),
});

const decayMode = z.strictObject({
  daughters: z.tuple([particleRef, particleRef]).describe('Two daughters by name or PDG id.'),
  branching: z.number().min(0).max(1),
});

const decayTable = z.strictObject({
  particle: particleName.describe('The decaying new particle; its antiparticle decays to the conjugate modes.'),
  modes: z.array(decayMode).min(1),
  closed_modes: z
    .enum(['error', 'rescale_open'])
    .default('error')
    .describe('A mode lighter than its daughters: error (default) or rescale_open (drop it and scale the open modes up so they sum to 1; for mass scans that cross a threshold).'),
});

/** The model file as written. */
export const modelFileSchema = z.strictObject({
  name: z.string().min(1).max(80).describe('Short name of the model point for reports.'),
  description: z.string().optional(),
  electroweak_scheme: z
    .enum(ELECTROWEAK_SCHEMES)
    .default('alpha_mz')
    .describe('alpha_mz: alpha(M_Z) and sin^2 theta_W in MSbar; fermi_constant: G_F, M_W, M_Z.'),
  particles: z.array(newParticle).min(1),
  resonances: z.array(resonance).default([]),
  channels: z.array(channel).min(1),
  decays: z.array(decayTable).default([]),
});

export type ModelFile = z.output<typeof modelFileSchema>;
export type ModelFileParticle = ModelFile['particles'][number];
export type ModelFileResonance = ModelFile['resonances'][number];
export type ModelFileChannel = ModelFile['channels'][number];
export type ModelFileDecayTable = ModelFile['decays'][number];
export type MassSpec = ModelFileParticle['mass'];
