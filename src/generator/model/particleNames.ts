/**
 * Readable names of Standard-Model particles in model files, and the lookup of
 * names and PDG ids (numbering of the PDG "Monte Carlo particle numbering
 * scheme"). Antiparticles of quarks and neutrinos take the suffix "bar";
 * charged leptons and W bosons carry their charge sign.
 */
import { PDG } from '../../physics/constants.js';
import type { ParticleTable } from '../particles.js';

/** Standard-Model names accepted in channels and decay tables, with their signed PDG ids. */
export const STANDARD_MODEL_NAMES: Readonly<Record<string, number>> = {
  d: PDG.d,
  dbar: -PDG.d,
  u: PDG.u,
  ubar: -PDG.u,
  s: PDG.s,
  sbar: -PDG.s,
  c: PDG.c,
  cbar: -PDG.c,
  b: PDG.b,
  bbar: -PDG.b,
  t: PDG.t,
  tbar: -PDG.t,
  'e-': PDG.e,
  'e+': -PDG.e,
  'mu-': PDG.mu,
  'mu+': -PDG.mu,
  'tau-': PDG.tau,
  'tau+': -PDG.tau,
  nu_e: PDG.nu_e,
  nu_ebar: -PDG.nu_e,
  nu_mu: PDG.nu_mu,
  nu_mubar: -PDG.nu_mu,
  nu_tau: PDG.nu_tau,
  nu_taubar: -PDG.nu_tau,
  g: PDG.g,
  gamma: PDG.gamma,
  Z: PDG.Z,
  'W+': PDG.W,
  'W-': -PDG.W,
  h: PDG.h,
};

/** Ids of the Standard-Model leptons that may form a produced pair (charged leptons and neutrinos). */
export function isLepton(id: number): boolean {
  const a = Math.abs(id);
  return a >= 11 && a <= 16;
}

/** A name table: Standard-Model names plus the model's particle and antiparticle names. */
export class ParticleNames {
  private readonly byName = new Map<string, number>();
  private readonly nameById = new Map<number, string>();

  constructor(private readonly table: ParticleTable) {
    for (const [name, id] of Object.entries(STANDARD_MODEL_NAMES)) this.set(name, id);
  }

  /** Adds a name for a signed id (the first name given for an id is the one `nameOf` returns). */
  set(name: string, id: number): void {
    this.byName.set(name, id);
    if (!this.nameById.has(id)) this.nameById.set(id, name);
  }

  hasName(name: string): boolean {
    return this.byName.has(name);
  }

  /**
   * The signed id of a name or of a PDG id written as a number, or undefined
   * when unknown (a negative id of a self-conjugate particle is unknown too).
   */
  resolve(ref: string | number): number | undefined {
    if (typeof ref === 'number') {
      if (!Number.isInteger(ref) || ref === 0 || !this.table.has(ref)) return undefined;
      if (ref < 0 && this.table.get(ref).selfConjugate) return undefined;
      return ref;
    }
    return this.byName.get(ref);
  }

  /** A readable name of a signed id (falls back to the number). */
  nameOf(id: number): string {
    return this.nameById.get(id) ?? String(id);
  }

  /** All names, for "known names are ..." hints. */
  names(): string[] {
    return [...this.byName.keys()];
  }
}
