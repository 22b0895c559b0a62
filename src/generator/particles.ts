/**
 * Particle data and decay tables shared by the generator parts: the Standard
 * Model particles tamis knows, and the new particles a model file adds.
 */
import { GAMMA_TOP, GAMMA_W, GAMMA_Z, GAMMA_H, M_B, M_C, M_E, M_H, M_MU, M_TAU, M_TOP, M_W, M_Z, M_PI_CHARGED, M_PI_NEUTRAL, M_RHO, M_A1 } from '../physics/constants.js';

export interface ParticleInfo {
  /** PDG id of the particle (positive); the antiparticle is -id unless `selfConjugate`. */
  id: number;
  name: string;
  /** Pole mass, GeV. */
  mass: number;
  /** Total width, GeV (0 = stable or treated as stable). */
  width: number;
  /** Electric charge of the particle with the positive id, in units of e. */
  charge: number;
  /** Twice the spin: 0 scalar, 1 fermion, 2 vector. */
  twiceSpin: number;
  /** Colour representation: 1, 3 or 8. */
  colour: number;
  selfConjugate: boolean;
}

/** One decay mode: daughters' PDG ids (for the particle with the positive id) and branching fraction. */
export interface DecayChannel {
  daughters: readonly number[];
  branching: number;
}

/** Decay modes of one particle (positive id); the antiparticle decays to the conjugate daughters. */
export interface DecayTable {
  parent: number;
  channels: readonly DecayChannel[];
  /** Modes of the model file dropped because they are closed at this mass (closed_modes: rescale_open), as written. */
  closedModes?: readonly string[];
}

/** Looks up particles by PDG id (either sign). */
export class ParticleTable {
  private readonly byId = new Map<number, ParticleInfo>();

  constructor(particles: Iterable<ParticleInfo> = STANDARD_MODEL_PARTICLES) {
    for (const p of particles) this.add(p);
  }

  add(p: ParticleInfo): void {
    this.byId.set(Math.abs(p.id), p);
  }

  has(id: number): boolean {
    return this.byId.has(Math.abs(id));
  }

  /** The particle data for `id` (either sign); throws for an unknown id. */
  get(id: number): ParticleInfo {
    const p = this.byId.get(Math.abs(id));
    if (p === undefined) throw new RangeError(`unknown particle id ${id}`);
    return p;
  }

  /** Charge of the particle with this signed id. */
  charge(id: number): number {
    const p = this.get(id);
    return id < 0 ? -p.charge : p.charge;
  }

  /** Id of the antiparticle. */
  conjugate(id: number): number {
    return this.get(id).selfConjugate ? id : -id;
  }

  all(): ParticleInfo[] {
    return [...this.byId.values()];
  }
}

const quark = (id: number, name: string, mass: number, charge: number, width = 0): ParticleInfo => ({ id, name, mass, width, charge, twiceSpin: 1, colour: 3, selfConjugate: false });
const lepton = (id: number, name: string, mass: number, charge: number): ParticleInfo => ({ id, name, mass, width: 0, charge, twiceSpin: 1, colour: 1, selfConjugate: false });

/** Standard-Model particles with the masses and widths of physics/constants (light quarks massless). */
export const STANDARD_MODEL_PARTICLES: readonly ParticleInfo[] = [
  quark(1, 'd', 0, -1 / 3),
  quark(2, 'u', 0, 2 / 3),
  quark(3, 's', 0, -1 / 3),
  quark(4, 'c', M_C, 2 / 3),
  quark(5, 'b', M_B, -1 / 3),
  quark(6, 't', M_TOP, 2 / 3, GAMMA_TOP),
  lepton(11, 'e-', M_E, -1),
  lepton(12, 'nu_e', 0, 0),
  lepton(13, 'mu-', M_MU, -1),
  lepton(14, 'nu_mu', 0, 0),
  lepton(15, 'tau-', M_TAU, -1),
  lepton(16, 'nu_tau', 0, 0),
  { id: 21, name: 'g', mass: 0, width: 0, charge: 0, twiceSpin: 2, colour: 8, selfConjugate: true },
  { id: 22, name: 'gamma', mass: 0, width: 0, charge: 0, twiceSpin: 2, colour: 1, selfConjugate: true },
  { id: 23, name: 'Z', mass: M_Z, width: GAMMA_Z, charge: 0, twiceSpin: 2, colour: 1, selfConjugate: true },
  { id: 24, name: 'W+', mass: M_W, width: GAMMA_W, charge: 1, twiceSpin: 2, colour: 1, selfConjugate: false },
  { id: 25, name: 'h', mass: M_H, width: GAMMA_H, charge: 0, twiceSpin: 0, colour: 1, selfConjugate: true },
  { id: 111, name: 'pi0', mass: M_PI_NEUTRAL, width: 0, charge: 0, twiceSpin: 0, colour: 1, selfConjugate: true },
  { id: 211, name: 'pi+', mass: M_PI_CHARGED, width: 0, charge: 1, twiceSpin: 0, colour: 1, selfConjugate: false },
  { id: 213, name: 'rho+', mass: M_RHO, width: 0, charge: 1, twiceSpin: 2, colour: 1, selfConjugate: false },
  { id: 20213, name: 'a1+', mass: M_A1, width: 0, charge: 1, twiceSpin: 2, colour: 1, selfConjugate: false },
];
