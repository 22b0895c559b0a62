/**
 * Resolves the new particles of a model file: names, ids, masses and Z couplings.
 */
import { STANDARD_MODEL_PARTICLES } from '../particles.js';
import { chiralFromVectorAxial, fermionZCouplings, scalarZCoupling } from '../electroweak.js';
import { STANDARD_MODEL_NAMES } from './particleNames.js';
import type { ResolveContext } from './resolveContext.js';
import type { ModelFile, ModelFileParticle } from './schema.js';
import type { NewParticle } from './types.js';

/** Tolerance of the check charge = weak_isospin + hypercharge. */
const CHARGE_TOLERANCE = 1e-9;

/** Default antiparticle name: a final "+" and "-" swap, otherwise "bar" is appended. */
export function defaultAntiName(name: string): string {
  if (name.endsWith('+')) return `${name.slice(0, -1)}-`;
  if (name.endsWith('-')) return `${name.slice(0, -1)}+`;
  return `${name}bar`;
}

/**
 * Checks that every name (particles, antiparticles, resonances) and every id is
 * unique and clashes with no Standard-Model name or id.
 */
export function checkNamesAndIds(file: ModelFile, context: ResolveContext): void {
  const names = new Map<string, string>();
  const ids = new Map<number, string>();
  const smIds = new Set(STANDARD_MODEL_PARTICLES.map((p) => p.id));
  const claimName = (name: string, path: (string | number)[], what: string): void => {
    if (name in STANDARD_MODEL_NAMES) context.fail(path, `name "${name}" is a Standard-Model particle name: choose another`);
    const previous = names.get(name);
    if (previous !== undefined) context.fail(path, `name "${name}" is already used by ${previous}`);
    names.set(name, what);
  };
  const claimId = (id: number, path: (string | number)[], what: string): void => {
    if (smIds.has(id)) context.fail(path, `id ${id} is a Standard-Model particle id: choose another (new states commonly use ids above 9000000)`);
    const previous = ids.get(id);
    if (previous !== undefined) context.fail(path, `id ${id} is already used by ${previous}`);
    ids.set(id, what);
  };
  file.particles.forEach((p, i) => {
    const anti = p.anti_name ?? defaultAntiName(p.name);
    claimName(p.name, ['particles', i, 'name'], `particles[${i}]`);
    if (anti === p.name) context.fail(['particles', i, 'anti_name'], `anti_name must differ from the name: new particles are not their own antiparticles`);
    claimName(anti, ['particles', i, p.anti_name === undefined ? 'name' : 'anti_name'], `the antiparticle of particles[${i}]`);
    claimId(p.id, ['particles', i, 'id'], `particles[${i}]`);
  });
  file.resonances.forEach((r, i) => {
    claimName(r.name, ['resonances', i, 'name'], `resonances[${i}]`);
    if (['photon', 'W'].includes(r.name)) context.fail(['resonances', i, 'name'], `name "${r.name}" is reserved for a Standard-Model vector`);
    claimId(r.id, ['resonances', i, 'id'], `resonances[${i}]`);
  });
}

/** Z couplings (units of g_Z) of one new particle from its quantum numbers or explicit couplings. */
function zCouplings(p: ModelFileParticle, i: number, context: ResolveContext, sin2W: number): { left: number; right: number } {
  const at = (key: string): (string | number)[] => ['particles', i, key];
  const hasIsospin = p.weak_isospin !== undefined;
  if (hasIsospin === (p.z_couplings !== undefined)) {
    context.fail(at(hasIsospin ? 'z_couplings' : 'name'), hasIsospin ? 'give weak_isospin or z_couplings, not both' : 'missing Z couplings: give weak_isospin (with optional hypercharge) or z_couplings');
  }
  if (p.spin === 0 && p.weak_isospin_right !== undefined) context.fail(at('weak_isospin_right'), 'weak_isospin_right applies to fermions only (spin 0.5)');
  if (p.weak_isospin !== undefined) {
    if (!Number.isInteger(2 * p.weak_isospin)) context.fail(at('weak_isospin'), `weak isospin must be a multiple of 1/2, got ${p.weak_isospin}`);
    if (p.weak_isospin_right !== undefined && !Number.isInteger(2 * p.weak_isospin_right)) {
      context.fail(at('weak_isospin_right'), `weak isospin must be a multiple of 1/2, got ${p.weak_isospin_right}`);
    }
    if (p.hypercharge !== undefined && Math.abs(p.weak_isospin + p.hypercharge - p.charge) > CHARGE_TOLERANCE) {
      context.fail(at('hypercharge'), `charge ${p.charge} differs from weak_isospin + hypercharge = ${p.weak_isospin + p.hypercharge} (convention Q = T3 + Y)`);
    }
    if (p.spin === 0) {
      const g = scalarZCoupling(p.weak_isospin, p.charge, sin2W);
      return { left: g, right: g };
    }
    const [left, right] = fermionZCouplings(p.weak_isospin, p.weak_isospin_right ?? p.weak_isospin, p.charge, sin2W);
    return { left, right };
  }
  if (p.hypercharge !== undefined) context.fail(at('hypercharge'), 'hypercharge needs weak_isospin (it only checks Q = T3 + Y)');
  const z = p.z_couplings!;
  if (p.spin === 0) {
    if (z.vector !== undefined || z.axial !== undefined) context.fail(['particles', i, 'z_couplings'], 'a scalar takes z_couplings.scalar, not vector/axial');
    if (z.scalar === undefined) context.fail(['particles', i, 'z_couplings'], 'missing z_couplings.scalar for a scalar');
    return { left: z.scalar, right: z.scalar };
  }
  if (z.scalar !== undefined) context.fail(['particles', i, 'z_couplings', 'scalar'], 'a fermion takes z_couplings.vector and axial, not scalar');
  const [left, right] = chiralFromVectorAxial(z.vector ?? 0, z.axial ?? 0);
  return { left, right };
}

/** The resolved new particles (names and ids already checked for uniqueness). */
export function resolveNewParticles(file: ModelFile, masses: ReadonlyMap<string, number>, context: ResolveContext, sin2W: number): NewParticle[] {
  return file.particles.map((p, i) => {
    const mass = masses.get(p.name)!;
    if (!(p.width < mass)) context.fail(['particles', i, 'width'], `width ${p.width} GeV must be below the mass ${mass} GeV`);
    return {
      name: p.name,
      antiName: p.anti_name ?? defaultAntiName(p.name),
      id: p.id,
      spin: p.spin,
      mass,
      width: p.width,
      charge: p.charge,
      z: zCouplings(p, i, context, sin2W),
    };
  });
}
