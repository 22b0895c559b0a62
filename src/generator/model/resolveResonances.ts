/**
 * Resolves the heavy vector resonances: couplings, pairs in canonical order,
 * and the total width (given, or "auto" = the sum of the tree-level partial
 * widths of resonanceWidths.ts).
 */
import { CKM, N_COLOURS, PDG } from '../../physics/constants.js';
import type { ParticleTable } from '../particles.js';
import { vectorToFermionsWidth, vectorToScalarsWidth } from '../resonanceWidths.js';
import { canonicalPair, samePair, type CanonicalPair } from './canonicalPair.js';
import type { ParticleNames } from './particleNames.js';
import type { ResolveContext } from './resolveContext.js';
import type { ModelFile, ModelFileResonance } from './schema.js';
import type { ChiralCouplings, PartialWidth, Resonance, ResonancePairCoupling } from './types.js';

const UP_TYPE = [PDG.u, PDG.c, PDG.t];
const DOWN_TYPE = [PDG.d, PDG.s, PDG.b];
const QUARKS = [PDG.d, PDG.u, PDG.s, PDG.c, PDG.b, PDG.t];
const CHARGED_LEPTONS = [PDG.e, PDG.mu, PDG.tau];

/** Relative tolerance when an explicit width is compared with the sum of partial widths. */
const WIDTH_TOLERANCE = 1e-9;

function resolvePairCouplings(r: ModelFileResonance, i: number, names: ParticleNames, table: ParticleTable, newIds: ReadonlySet<number>, context: ResolveContext): ResonancePairCoupling[] {
  const out: (ResonancePairCoupling & { canonical: CanonicalPair })[] = [];
  r.pair_couplings.forEach((entry, j) => {
    const at = ['resonances', i, 'pair_couplings', j];
    const ids = entry.pair.map((name, k) => {
      const id = names.resolve(name);
      if (id === undefined || !newIds.has(Math.abs(id))) {
        context.fail([...at, 'pair', k], `"${name}" is not a new particle of this model`, 'resonance couplings to leptons go under lepton_couplings');
      }
      return id;
    });
    const canonical = canonicalPair(ids[0]!, ids[1]!, table);
    if (typeof canonical === 'string') context.fail([...at, 'pair'], canonical);
    if (canonical.charge !== r.charge) {
      context.fail([...at, 'pair'], `pair charge ${canonical.charge === 0 ? 0 : '+-1'} does not match the resonance charge ${r.charge === 0 ? 0 : '+-1'}`);
    }
    let coupling: ChiralCouplings;
    if (canonical.spin === 0) {
      if (entry.left !== undefined || entry.right !== undefined) context.fail(at, 'a scalar pair takes "coupling", not left/right');
      if (entry.coupling === undefined) context.fail(at, 'missing "coupling" for a scalar pair');
      const g = canonical.swapped ? -entry.coupling : entry.coupling;
      coupling = { left: g, right: g };
    } else {
      if (entry.coupling !== undefined) context.fail([...at, 'coupling'], 'a fermion pair takes left/right couplings, not "coupling"');
      if (entry.left === undefined && entry.right === undefined) context.fail(at, 'missing left/right couplings for a fermion pair');
      coupling = { left: entry.left ?? 0, right: entry.right ?? 0 };
    }
    for (const previous of out) {
      if (samePair(previous.canonical, canonical) !== 'different') context.fail([...at, 'pair'], `pair [${entry.pair.join(', ')}] is listed twice`);
    }
    out.push({ first: canonical.first, second: canonical.second, coupling, canonical });
  });
  return out.map(({ first, second, coupling }) => ({ first, second, coupling }));
}

/** Tree-level partial widths of a resolved resonance (zero channels omitted). */
export function resonancePartialWidths(
  mass: number,
  charge: 0 | 1,
  quark: ChiralCouplings,
  lepton: ChiralCouplings,
  neutrino: number,
  pairs: readonly ResonancePairCoupling[],
  table: ParticleTable,
  names: ParticleNames,
): PartialWidth[] {
  const widths: PartialWidth[] = [];
  const push = (finalState: string, width: number): void => {
    if (width > 0) widths.push({ finalState, width });
  };
  const m = (id: number): number => table.get(id).mass;
  if (charge === 0) {
    for (const q of QUARKS) push(`${names.nameOf(q)} ${names.nameOf(-q)}`, vectorToFermionsWidth(mass, quark.left, quark.right, m(q), m(q), N_COLOURS));
    for (const l of CHARGED_LEPTONS) push(`${names.nameOf(l)} ${names.nameOf(-l)}`, vectorToFermionsWidth(mass, lepton.left, lepton.right, m(l), m(l), 1));
    for (const l of CHARGED_LEPTONS) push(`${names.nameOf(l + 1)} ${names.nameOf(-(l + 1))}`, vectorToFermionsWidth(mass, neutrino, 0, 0, 0, 1));
  } else {
    UP_TYPE.forEach((u, a) =>
      DOWN_TYPE.forEach((d, b) => {
        const v2 = CKM[a]![b]! ** 2;
        push(`${names.nameOf(u)} ${names.nameOf(-d)}`, v2 * vectorToFermionsWidth(mass, quark.left, quark.right, m(u), m(d), N_COLOURS));
      }),
    );
    for (const l of CHARGED_LEPTONS) push(`${names.nameOf(l + 1)} ${names.nameOf(-l)}`, vectorToFermionsWidth(mass, lepton.left, 0, 0, m(l), 1));
  }
  for (const pair of pairs) {
    const m1 = m(pair.first);
    const m2 = m(pair.second);
    const width = table.get(pair.first).twiceSpin === 0 ? vectorToScalarsWidth(mass, pair.coupling.left, m1, m2) : vectorToFermionsWidth(mass, pair.coupling.left, pair.coupling.right, m1, m2, 1);
    push(`${names.nameOf(pair.first)} ${names.nameOf(pair.second)}`, width);
  }
  return widths;
}

/** The resolved resonances of a model file. */
export function resolveResonances(
  file: ModelFile,
  masses: ReadonlyMap<string, number>,
  names: ParticleNames,
  table: ParticleTable,
  newIds: ReadonlySet<number>,
  context: ResolveContext,
): Resonance[] {
  return file.resonances.map((r, i) => {
    const mass = masses.get(r.name)!;
    const leptonFile = r.lepton_couplings;
    if (r.charge === 1 && leptonFile !== undefined) {
      if (leptonFile.right !== 0) context.fail(['resonances', i, 'lepton_couplings', 'right'], 'a charged resonance couples to l nu through left-handed currents only (there are no right-handed neutrinos)');
      if (leptonFile.neutrino !== undefined) context.fail(['resonances', i, 'lepton_couplings', 'neutrino'], 'neutrino applies to neutral resonances; a charged one uses left for l nu');
    }
    const quark = { left: r.quark_couplings.left, right: r.quark_couplings.right };
    const lepton = { left: leptonFile?.left ?? 0, right: leptonFile?.right ?? 0 };
    const neutrino = r.charge === 0 ? (leptonFile?.neutrino ?? lepton.left) : 0;
    const pairs = resolvePairCouplings(r, i, names, table, newIds, context);
    const partialWidths = resonancePartialWidths(mass, r.charge, quark, lepton, neutrino, pairs, table, names);
    const sum = partialWidths.reduce((s, w) => s + w.width, 0);
    const widthIsAuto = r.width === 'auto';
    const width = r.width === 'auto' ? sum : r.width;
    const at = ['resonances', i, 'width'];
    if (widthIsAuto && !(sum > 0)) context.fail(at, 'width "auto" is zero: the resonance has no open decay channel', 'give quark, lepton or pair couplings, or a width in GeV');
    if (!widthIsAuto && width < sum * (1 - WIDTH_TOLERANCE)) {
      context.fail(at, `width ${width} GeV is below the sum of its tree-level partial widths, ${sum.toPrecision(6)} GeV`, 'use width: auto');
    }
    if (!(width < mass)) context.fail(at, `width ${width.toPrecision(6)} GeV is not below the mass ${mass} GeV: couplings too large for a Breit-Wigner resonance`);
    return { name: r.name, id: r.id, charge: r.charge, mass, width, widthIsAuto, partialWidths, quark, lepton, neutrino, pairs };
  });
}
