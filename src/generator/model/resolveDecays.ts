/**
 * Resolves the decay tables of the new particles: daughters to PDG ids, with
 * charge conservation, the kinematic threshold and the branching sum checked.
 */
import type { DecayChannel, DecayTable, ParticleTable } from '../particles.js';
import type { ParticleNames } from './particleNames.js';
import type { ResolveContext } from './resolveContext.js';
import type { ModelFile } from './schema.js';
import type { NewParticle } from './types.js';

/** Largest allowed |sum of branching fractions - 1| (the tolerance). */
export const BRANCHING_SUM_TOLERANCE = 1e-6;
const CHARGE_TOLERANCE = 1e-9;

export function resolveDecays(file: ModelFile, newParticles: readonly NewParticle[], names: ParticleNames, table: ParticleTable, context: ResolveContext): DecayTable[] {
  const done = new Set<number>();
  return file.decays.map((entry, i) => {
    const at = ['decays', i];
    const parent = newParticles.find((p) => p.name === entry.particle);
    if (parent === undefined) {
      const anti = newParticles.find((p) => p.antiName === entry.particle);
      if (anti !== undefined) context.fail([...at, 'particle'], `"${entry.particle}" is an antiparticle`, `give the table of ${anti.name}: its antiparticle decays to the conjugate modes`);
      context.fail([...at, 'particle'], `"${entry.particle}" is not a new particle of this model`, newParticles.length > 0 ? `new particles: ${newParticles.map((p) => p.name).join(', ')}` : undefined);
    }
    if (done.has(parent.id)) context.fail([...at, 'particle'], `${parent.name} has two decay tables`);
    done.add(parent.id);
    const seen = new Set<string>();
    let sum = 0;
    let openSum = 0;
    const closed: string[] = [];
    const all: (DecayChannel & { open: boolean })[] = entry.modes.map((mode, j) => {
      const modeAt = [...at, 'modes', j];
      const daughters = mode.daughters.map((ref, k) => {
        const id = names.resolve(ref);
        if (id === undefined) context.fail([...modeAt, 'daughters', k], `unknown particle "${ref}"`, 'use a Standard-Model name (t, bbar, tau+, nu_tau, W+, Z, h, ...), a new particle name or a PDG id');
        if (Math.abs(id) === parent.id) context.fail([...modeAt, 'daughters', k], `${parent.name} cannot decay to itself`);
        return id;
      });
      const charge = daughters.reduce((q, id) => q + table.charge(id), 0);
      if (Math.abs(charge - parent.charge) > CHARGE_TOLERANCE) {
        context.fail([...modeAt, 'daughters'], `charge is not conserved: ${parent.name} has charge ${parent.charge}, the daughters ${formatCharge(charge)}`);
      }
      if (!colourSinglet(daughters, table)) context.fail([...modeAt, 'daughters'], 'colour is not conserved: a colour-singlet parent decays to two singlets, a quark and an antiquark, or two gluons');
      const daughterMass = daughters.reduce((m, id) => m + table.get(id).mass, 0);
      const open = parent.mass >= daughterMass;
      if (!open) {
        if (entry.closed_modes === 'error') {
          context.fail([...modeAt, 'daughters'], `${parent.name} (${parent.mass} GeV) is lighter than its daughters (${daughterMass.toPrecision(6)} GeV): the mode is closed`, 'set closed_modes: rescale_open on this table to drop closed modes in a mass scan');
        }
        closed.push(mode.daughters.join(' '));
      }
      const key = [...daughters].sort((a, b) => a - b).join(',');
      if (seen.has(key)) context.fail([...modeAt, 'daughters'], 'this mode is listed twice');
      seen.add(key);
      sum += mode.branching;
      if (open) openSum += mode.branching;
      return { daughters, branching: mode.branching, open };
    });
    if (Math.abs(sum - 1) > BRANCHING_SUM_TOLERANCE) {
      context.fail([...at, 'modes'], `branching fractions of ${parent.name} sum to ${sum.toPrecision(10)}, not 1 (tolerance ${BRANCHING_SUM_TOLERANCE})`);
    }
    if (closed.length > 0 && !(openSum > 0)) {
      context.fail([...at, 'modes'], `every mode of ${parent.name} (${parent.mass} GeV) with a non-zero branching fraction is closed`);
    }
    // Closed modes are dropped and the open ones scaled up to sum to 1 (closed_modes: rescale_open).
    const channels: DecayChannel[] = all.filter((c) => c.open).map((c) => ({ daughters: c.daughters, branching: closed.length > 0 ? c.branching / openSum : c.branching }));
    return closed.length > 0 ? { parent: parent.id, channels, closedModes: closed } : { parent: parent.id, channels };
  });
}

/** Two daughters form a colour singlet: 1 x 1, 3 x 3bar or 8 x 8 (SU(3) tensor products, common practice). */
function colourSinglet(daughters: readonly number[], table: ParticleTable): boolean {
  const [a, b] = daughters as [number, number];
  const ca = table.get(a).colour;
  const cb = table.get(b).colour;
  if (ca === 1 && cb === 1) return true;
  if (ca === 8 && cb === 8) return true;
  return ca === 3 && cb === 3 && a > 0 !== b > 0;
}

function formatCharge(q: number): string {
  const thirds = Math.round(q * 3);
  if (Math.abs(q * 3 - thirds) < 1e-9 && thirds % 3 !== 0) return `${thirds}/3`;
  return String(Number(q.toPrecision(10)));
}
