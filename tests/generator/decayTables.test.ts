import { describe, expect, it } from 'vitest';
import { TamisError } from '../../src/errors.js';
import { SIN2_THETA_W } from '../../src/physics/constants.js';
import { ParticleTable } from '../../src/generator/particles.js';
import { BUILTIN_DECAY_TABLES, createDecayer, zQuarkCouplingWeight, type Decayer } from '../../src/generator/decays/index.js';
import { expectClose } from '../helpers.js';
import { HEAVY_LEPTON, testParticles } from './decayTestUtils.js';

function expectTamisError(fn: () => Decayer, code: string, pattern: RegExp): void {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(TamisError);
    expect((error as TamisError).code).toBe(code);
    expect((error as TamisError).message).toMatch(pattern);
    return;
  }
  expect.fail('no error thrown');
}

describe('decay tables', () => {
  it('every built-in table sums to 1 and covers t, W, Z, h, tau', () => {
    expect(BUILTIN_DECAY_TABLES.map((t) => t.parent).sort((a, b) => a - b)).toEqual([6, 15, 23, 24, 25]);
    for (const t of BUILTIN_DECAY_TABLES) expectClose(t.channels.reduce((s, c) => s + c.branching, 0), 1, { abs: 1e-12 });
  });

  it('Z couplings: g_L^2 + g_R^2 = 0.14336 (up) and 0.18479 (down) with sin^2 theta_W = 0.23129 [C]', () => {
    expect(SIN2_THETA_W).toBe(0.23129);
    expectClose(zQuarkCouplingWeight(2 / 3, 0.5), (0.5 - (2 / 3) * 0.23129) ** 2 + ((2 / 3) * 0.23129) ** 2, { rel: 1e-12 });
    expectClose(zQuarkCouplingWeight(2 / 3, 0.5), 0.14336, { abs: 1e-5 });
    expectClose(zQuarkCouplingWeight(-1 / 3, -0.5), 0.18479, { abs: 1e-5 });
  });

  it('rejects tables that do not sum to 1, with the particle named', () => {
    const particles = testParticles();
    expectTamisError(
      () => createDecayer(particles, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [23, 15], branching: 0.5 }] }]),
      'bad_input',
      /branching fractions of L- sum to 0.5, not 1/,
    );
  });

  it('rejects unknown daughters, negative branching fractions, wrong daughter counts and duplicate tables', () => {
    const particles = testParticles();
    expectTamisError(() => createDecayer(particles, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [23, 4242], branching: 1 }] }]), 'bad_input', /unknown particle id 4242/);
    expectTamisError(
      () =>
        createDecayer(particles, [
          {
            parent: HEAVY_LEPTON.id,
            channels: [
              { daughters: [23, 15], branching: -0.5 },
              { daughters: [25, 15], branching: 1.5 },
            ],
          },
        ]),
      'bad_input',
      /must be a number >= 0, got -0.5/,
    );
    expectTamisError(() => createDecayer(particles, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [23], branching: 1 }] }]), 'bad_input', /1 daughters/);
    expectTamisError(
      () =>
        createDecayer(particles, [
          { parent: HEAVY_LEPTON.id, channels: [{ daughters: [23, 15], branching: 1 }] },
          { parent: HEAVY_LEPTON.id, channels: [{ daughters: [25, 15], branching: 1 }] },
        ]),
      'bad_input',
      /two decay tables/,
    );
  });

  it('rejects closed channels and colour structures it cannot connect', () => {
    const particles = testParticles();
    expectTamisError(() => createDecayer(particles, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [6, 6, 15], branching: 1 }] }]), 'bad_input', /colour/);
    const light = new ParticleTable([...particles.all(), { ...HEAVY_LEPTON, mass: 150 }]);
    expectTamisError(() => createDecayer(light, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [-24, 6], branching: 1 }] }]), 'bad_input', /colour/);
    expectTamisError(() => createDecayer(light, [{ parent: HEAVY_LEPTON.id, channels: [{ daughters: [25, 23, 15], branching: 1 }] }]), 'physics', /is closed/);
  });

  it('a model table replaces the built-in one of the same parent', () => {
    const decayer = createDecayer(new ParticleTable(), [{ parent: 15, channels: [{ daughters: [-211, 16], branching: 1 }] }]);
    const tau = decayer.tables.find((t) => t.parent === 15)!;
    expect(tau.channels).toHaveLength(1);
    expect(createDecayer(new ParticleTable(), [], { builtinTables: false }).decays(24)).toBe(false);
  });
});
