/**
 * Resolves the production channels: the pair in canonical order, and for each
 * s-channel vector its couplings to the quark currents and to the pair
 * (conventions of electroweak.ts), ready for the matrix elements.
 */
import { GAMMA_W, GAMMA_Z, M_W, M_Z } from '../../physics/constants.js';
import { fermionZCouplings, type ElectroweakCouplings } from '../electroweak.js';
import type { ParticleTable } from '../particles.js';
import { canonicalPair, type CanonicalPair } from './canonicalPair.js';
import { isLepton, type ParticleNames } from './particleNames.js';
import type { ResolveContext } from './resolveContext.js';
import { MAX_MASS_GEV, type ModelFile, type ModelFileChannel } from './schema.js';
import type { ChiralCouplings, MediatorCouplings, NewParticle, ProductionChannel, Resonance, ScaleChoice } from './types.js';

/** Lowest pair mass a channel may reach, GeV: below it the photon pole and the parton densities' range make the LO sum meaningless. */
export const MIN_PAIR_MASS_GEV = 10;
/** Lowest average pair mass accepted as a fixed factorisation scale, GeV. */
const MIN_AVERAGE_MASS_SCALE_GEV = 5;

const ZERO: ChiralCouplings = { left: 0, right: 0 };
const scaled = (c: ChiralCouplings, f: number): ChiralCouplings => ({ left: f * c.left, right: f * c.right });
const both = (g: number): ChiralCouplings => ({ left: g, right: g });

interface ChannelInputs {
  couplings: ElectroweakCouplings;
  table: ParticleTable;
  names: ParticleNames;
  newParticles: readonly NewParticle[];
  resonances: readonly Resonance[];
  context: ResolveContext;
}

/** Z couplings (units of g_Z) of the first particle of a neutral canonical pair. */
function zOfPair(first: number, inputs: ChannelInputs): ChiralCouplings {
  const fresh = inputs.newParticles.find((p) => p.id === first);
  if (fresh !== undefined) return fresh.z;
  const charge = inputs.table.charge(first);
  const t3 = first % 2 === 0 ? 0.5 : -0.5; // neutrinos (even ids) up, charged leptons down
  const [left, right] = fermionZCouplings(t3, 0, charge, inputs.couplings.sin2W);
  return { left, right };
}

/** Coupling of a resonance to a canonical pair, or undefined when it has none. */
function resonancePairCoupling(r: Resonance, pair: CanonicalPair): ChiralCouplings | undefined {
  if (isLepton(pair.first)) {
    let c: ChiralCouplings;
    if (r.charge === 0) c = Math.abs(pair.first) % 2 === 0 ? { left: r.neutrino, right: 0 } : r.lepton;
    else c = { left: r.lepton.left, right: 0 };
    return c.left !== 0 || c.right !== 0 ? c : undefined;
  }
  for (const p of r.pairs) {
    if (p.first === pair.first && p.second === pair.second) return p.coupling;
    // Only charged scalar pairs can be listed in the other order: the current changes sign.
    if (p.first === pair.second && p.second === pair.first) return scaled(p.coupling, -1);
  }
  return undefined;
}

function wPairCoupling(ch: ModelFileChannel, pair: CanonicalPair, at: (string | number)[], inputs: ChannelInputs): ChiralCouplings {
  const context: ResolveContext = inputs.context;
  if (isLepton(pair.first)) {
    if (ch.w_coupling !== undefined) context.fail([...at, 'w_coupling'], 'the W coupling of Standard-Model leptons is fixed: remove w_coupling');
    return { left: 1, right: 0 };
  }
  if (pair.spin === 0) {
    if (ch.w_coupling === undefined) return both(1);
    if (typeof ch.w_coupling !== 'number') context.fail([...at, 'w_coupling'], 'a scalar pair takes a number (units of g/sqrt 2)');
    return both(ch.w_coupling);
  }
  if (ch.w_coupling === undefined) context.fail(at, 'a fermion pair through W needs w_coupling: {left, right} (units of g/sqrt 2)');
  if (typeof ch.w_coupling === 'number') context.fail([...at, 'w_coupling'], 'a fermion pair takes w_coupling: {left, right}');
  return { left: ch.w_coupling.left, right: ch.w_coupling.right };
}

function mediatorFor(name: string, k: number, ch: ModelFileChannel, pair: CanonicalPair, at: (string | number)[], inputs: ChannelInputs): MediatorCouplings {
  const ew = inputs.couplings;
  const context: ResolveContext = inputs.context;
  const where = [...at, 'through', k];
  const neutral = pair.charge === 0;
  if (name === 'photon' || name === 'Z') {
    if (!neutral) context.fail(where, `${name} cannot produce a charged pair: use W or a charged resonance`);
    if (name === 'photon') {
      const q = inputs.table.charge(pair.first);
      if (q === 0) context.fail(where, 'the photon does not couple to a neutral pair');
      return { name, mass: 0, width: 0, up: both((2 / 3) * ew.e), down: both((-1 / 3) * ew.e), pair: both(q * ew.e) };
    }
    const [uL, uR] = fermionZCouplings(0.5, 0, 2 / 3, ew.sin2W);
    const [dL, dR] = fermionZCouplings(-0.5, 0, -1 / 3, ew.sin2W);
    return { name, mass: M_Z, width: GAMMA_Z, up: scaled({ left: uL, right: uR }, ew.gZ), down: scaled({ left: dL, right: dR }, ew.gZ), pair: scaled(zOfPair(pair.first, inputs), ew.gZ) };
  }
  if (name === 'W') {
    if (neutral) context.fail(where, 'W cannot produce a neutral pair: use photon, Z or a neutral resonance');
    const g = ew.gW / Math.SQRT2;
    return { name, mass: M_W, width: GAMMA_W, up: { left: g, right: 0 }, down: ZERO, pair: scaled(wPairCoupling(ch, pair, at, inputs), g) };
  }
  const r = inputs.resonances.find((x) => x.name === name);
  if (r === undefined) {
    context.fail(where, `unknown vector "${name}"`, `choose photon, Z, W${inputs.resonances.length > 0 ? ', ' + inputs.resonances.map((x) => x.name).join(', ') : ''}`);
  }
  if (r.charge !== pair.charge) context.fail(where, `resonance ${name} has charge ${r.charge === 0 ? 0 : '+-1'} but the pair has charge ${neutral ? 0 : '+-1'}`);
  const pc = resonancePairCoupling(r, pair);
  if (pc === undefined) context.fail(where, `resonance ${name} has no coupling to this pair`, isLepton(pair.first) ? 'give it lepton_couplings' : 'add the pair to its pair_couplings');
  return { name, mass: r.mass, width: r.width, up: r.quark, down: neutral ? r.quark : ZERO, pair: pc };
}

function resolveOne(ch: ModelFileChannel, index: number, inputs: ChannelInputs): ProductionChannel {
  const context: ResolveContext = inputs.context;
  const { names, table } = inputs;
  const at: (string | number)[] = ['channels', index];
  const ids = ch.pair.map((ref, k) => {
    const id = names.resolve(ref);
    if (id === undefined) context.fail([...at, 'pair', k], `unknown particle "${ref}"`, 'use a new particle name, its anti_name, a lepton name (e-, e+, mu-, nu_mu, ...) or a PDG id');
    const isNew = inputs.newParticles.some((p) => p.id === Math.abs(id));
    if (!isNew && !isLepton(id)) context.fail([...at, 'pair', k], `"${ref}" cannot be produced in a channel: pairs are new particles or leptons`);
    return id;
  });
  if (isLepton(ids[0]!) !== isLepton(ids[1]!)) context.fail([...at, 'pair'], 'a pair is either two new particles or two Standard-Model leptons');
  const pair = canonicalPair(ids[0]!, ids[1]!, table);
  if (typeof pair === 'string') context.fail([...at, 'pair'], pair);
  if (isLepton(pair.first) && pair.charge === 1 && Math.abs(pair.first) !== Math.abs(pair.second) + 1) {
    context.fail([...at, 'pair'], 'a charged lepton pair from W must be a lepton and a neutrino of the same flavour');
  }
  const seen = new Set<string>();
  ch.through.forEach((name, k) => {
    if (seen.has(name)) context.fail([...at, 'through', k], `"${name}" is listed twice`);
    seen.add(name);
  });
  if (ch.w_coupling !== undefined && !seen.has('W')) context.fail([...at, 'w_coupling'], 'w_coupling is used only when W is among the vectors in "through"');
  const mediators = ch.through.map((name, k) => mediatorFor(name, k, ch, pair, at, inputs));
  const firstMass = table.get(pair.first).mass;
  const secondMass = table.get(pair.second).mass;
  const threshold = firstMass + secondMass;
  const [low, high] = ch.mass_range ?? [threshold, MAX_MASS_GEV];
  if (low < threshold * (1 - 1e-12)) context.fail([...at, 'mass_range'], `mass_range starts at ${low} GeV, below the pair threshold ${threshold} GeV`);
  if (!(high > low)) context.fail([...at, 'mass_range'], `mass_range must rise, got [${low}, ${high}]`);
  if (Math.max(low, threshold) < MIN_PAIR_MASS_GEV) {
    context.fail(ch.mass_range ? [...at, 'mass_range'] : [...at, 'pair'], `the pair mass must stay above ${MIN_PAIR_MASS_GEV} GeV`, `give mass_range: [low, high] with low >= ${MIN_PAIR_MASS_GEV}`);
  }
  const leptonic = isLepton(pair.first);
  let scale: ScaleChoice;
  const s = ch.scale ?? (leptonic ? 'pair_mass' : 'average_mass');
  if (typeof s === 'number') scale = { kind: 'fixed', value: s };
  else if (s === 'pair_mass') scale = { kind: 'pair_mass' };
  else {
    if (threshold / 2 < MIN_AVERAGE_MASS_SCALE_GEV) context.fail([...at, 'scale'], `the average pair mass ${threshold / 2} GeV is too low for a scale`, 'use scale: pair_mass');
    scale = { kind: 'average_mass' };
  }
  return {
    index,
    name: ch.name,
    kind: pair.charge === 0 ? 'neutral' : 'charged',
    spin: pair.spin,
    first: pair.first,
    second: pair.second,
    firstMass,
    secondMass,
    mediators,
    kFactor: ch.k_factor,
    massRange: [Math.max(low, threshold), high],
    scale,
  };
}

/** The resolved channels of a model file (names unique). */
export function resolveChannels(file: ModelFile, inputs: ChannelInputs): ProductionChannel[] {
  const names = new Set<string>();
  return file.channels.map((ch, i) => {
    if (names.has(ch.name)) inputs.context.fail(['channels', i, 'name'], `channel name "${ch.name}" is used twice`);
    names.add(ch.name);
    return resolveOne(ch, i, inputs);
  });
}

