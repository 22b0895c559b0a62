/**
 * The resolved model: every default applied, every name turned into a PDG id,
 * every mass a number, every width computed. What the user wrote lives in
 * `schema.ts`; the hard processes, the cross sections and the decay chains
 * read only these types.
 */
import type { ElectroweakCouplings } from '../electroweak.js';
import type { DecayTable, ParticleTable } from '../particles.js';

/** Couplings to a left- and a right-handed current. For scalar currents `left === right` = g. */
export interface ChiralCouplings {
  readonly left: number;
  readonly right: number;
}

/** A new particle of the model (complex scalar or Dirac fermion, colour singlet). */
export interface NewParticle {
  readonly name: string;
  readonly antiName: string;
  /** PDG-style id (positive); the antiparticle is -id. */
  readonly id: number;
  readonly spin: 0 | 0.5;
  /** GeV. */
  readonly mass: number;
  /** GeV. */
  readonly width: number;
  /** Units of e. */
  readonly charge: number;
  /** Z couplings in units of g_Z (scalars: left = right = g_S). */
  readonly z: ChiralCouplings;
}

/** One partial width of a resonance, GeV. */
export interface PartialWidth {
  /** Readable final state, e.g. "u ubar", "S+ S-". */
  readonly finalState: string;
  readonly width: number;
}

/** A coupling of a resonance to a pair, with the pair put in canonical order (see `canonicalPair`). */
export interface ResonancePairCoupling {
  readonly first: number;
  readonly second: number;
  /** Scalars: left = right = g of -i g (k_first - k_second)^mu; fermions: chiral couplings of ubar(first) Gamma v(second). */
  readonly coupling: ChiralCouplings;
}

/** A heavy vector resonance exchanged in the s channel. */
export interface Resonance {
  readonly name: string;
  readonly id: number;
  /** 0 neutral, 1 charged (the conjugate with charge -1 is implied). */
  readonly charge: 0 | 1;
  readonly mass: number;
  /** Total width used in the propagator, GeV. */
  readonly width: number;
  /** True when the width is the sum of `partialWidths`. */
  readonly widthIsAuto: boolean;
  readonly partialWidths: readonly PartialWidth[];
  /** Absolute couplings to quark currents (charged: times |V_ij|). */
  readonly quark: ChiralCouplings;
  /** Absolute couplings to charged-lepton currents (charged resonances: l nu, left only). */
  readonly lepton: ChiralCouplings;
  /** Neutral resonances: coupling to left-handed neutrinos. */
  readonly neutrino: number;
  readonly pairs: readonly ResonancePairCoupling[];
}

/**
 * One s-channel vector of a production channel with its couplings, ready for
 * the matrix element: every product c_initial * c_final * propagator is summed.
 */
export interface MediatorCouplings {
  readonly name: string;
  /** Pole mass (0 for the photon) and width in GeV; the propagator is 1/(s - M^2 + i s Gamma/M). */
  readonly mass: number;
  readonly width: number;
  /** Coupling to the up-type quark current (charged channels: to u_i dbar_j, times |V_ij|). */
  readonly up: ChiralCouplings;
  /** Coupling to the down-type quark current (neutral channels only). */
  readonly down: ChiralCouplings;
  /** Coupling to the produced pair (scalars: left = right). */
  readonly pair: ChiralCouplings;
}

/** How mu_F = mu_R is chosen for a channel. */
export type ScaleChoice = { readonly kind: 'average_mass' } | { readonly kind: 'pair_mass' } | { readonly kind: 'fixed'; readonly value: number };

/** A production channel: q qbar(') -> vectors -> pair, charge conjugates included. */
export interface ProductionChannel {
  /** Position in `Model.channels`; the event's process id. */
  readonly index: number;
  readonly name: string;
  /** neutral: q qbar -> X Xbar; charged: u_i dbar_j -> X Y (charge +1) plus the conjugate. */
  readonly kind: 'neutral' | 'charged';
  readonly spin: 0 | 0.5;
  /**
   * PDG ids of the pair in canonical order: fermions, the fermion then the
   * antifermion; charged channels, the charge +1 state.
   */
  readonly first: number;
  readonly second: number;
  readonly firstMass: number;
  readonly secondMass: number;
  readonly mediators: readonly MediatorCouplings[];
  readonly kFactor: number;
  /** Window on the pair mass, GeV. */
  readonly massRange: readonly [number, number];
  readonly scale: ScaleChoice;
}

/** A model ready for cross sections, event generation and decays. */
export interface Model {
  readonly name: string;
  readonly description: string;
  /** The file it was read from ('' when built in memory). */
  readonly file: string;
  readonly couplings: ElectroweakCouplings;
  /** Standard-Model particles plus the new particles (resonances are not in it: they only appear in the s channel). */
  readonly particles: ParticleTable;
  readonly newParticles: readonly NewParticle[];
  readonly resonances: readonly Resonance[];
  readonly channels: readonly ProductionChannel[];
  /** Decay tables of the new particles, daughters as PDG ids (for the positive-id parent). */
  readonly decayTables: readonly DecayTable[];
}
