/**
 * The model loader: a valid file resolves as documented, and every kind of
 * mistake gives one TamisError naming file, line, column and key.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import { TamisError, formatError } from '../../src/errors.js';
import { loadModel, parseModel } from '../../src/generator/model/index.js';
import { SIN2_THETA_W } from '../../src/physics/constants.js';
import { electroweakCouplings } from '../../src/generator/electroweak.js';
import { expectClose } from '../helpers.js';

const BASE = `name: test-model
particles:
  - name: S+
    id: 9000211
    spin: 0
    mass: 300
    charge: 1
    weak_isospin: 0.5
    hypercharge: 0.5
  - name: S0
    id: 9000111
    spin: 0
    mass: {ratio: 0.9, of: S+}
    charge: 0
    weak_isospin: -0.5
  - name: E-
    id: 9000011
    spin: 0.5
    mass: 400
    charge: -1
    z_couplings: {vector: 0.2, axial: -0.1}
resonances:
  - name: V0
    id: 9000023
    charge: 0
    mass: {ratio: 4, of: S+}
    width: auto
    quark_couplings: {left: 0.1, right: 0.1}
    lepton_couplings: {left: 0.05}
    pair_couplings:
      - {pair: [S+, S-], coupling: 0.5}
      - {pair: [E-, E+], left: 0.3, right: 0.2}
channels:
  - name: charged
    pair: [S+, S-]
    through: [photon, Z, V0]
    k_factor: 1.3
  - name: mixed
    pair: [S0bar, S+]
    through: [W]
  - name: leptons
    pair: [E+, E-]
    through: [photon, Z, V0]
  - name: dimuon
    pair: [mu-, mu+]
    through: [V0]
    mass_range: [1000, 1400]
decays:
  - particle: S+
    modes:
      - {daughters: [tau+, nu_tau], branching: 0.6}
      - {daughters: [t, bbar], branching: 0.4}
  - particle: E-
    modes:
      - {daughters: [tau-, Z], branching: 1}
`;

/** The error thrown for BASE with `from` replaced by `to` (the replacement must apply). */
function errorFor(from: string, to: string): TamisError {
  expect(BASE.includes(from), `test setup: "${from}" not in BASE`).toBe(true);
  try {
    parseModel(BASE.replace(from, to), 'm.model.yaml');
  } catch (error) {
    if (error instanceof TamisError) return error;
    throw error;
  }
  throw new Error('expected a TamisError');
}

/** Line of the first occurrence of `text` in the modified file. */
function lineOf(text: string, from: string, to: string): number {
  const modified = BASE.replace(from, to);
  return modified.slice(0, modified.indexOf(text)).split('\n').length;
}

describe('model files that load', () => {
  it('resolves masses, ids, couplings, channels and decay tables', () => {
    const model = parseModel(BASE, 'm.model.yaml');
    expect(model.name).toBe('test-model');
    expect(model.newParticles.map((p) => [p.name, p.antiName, p.mass])).toEqual([
      ['S+', 'S-', 300],
      ['S0', 'S0bar', 270],
      ['E-', 'E+', 400],
    ]);
    // g_S = T3 - Q s_W^2 (checks.md section 4); fermion (g_L, g_R) = ((g_V + g_A)/2, (g_V - g_A)/2).
    expectClose(model.newParticles[0]!.z.left, 0.5 - SIN2_THETA_W, { rel: 1e-12 });
    expect(model.newParticles[2]!.z).toEqual({ left: 0.05, right: 0.15000000000000002 });
    const v0 = model.resonances[0]!;
    expect(v0.mass).toBe(1200);
    expectClose(v0.width, v0.partialWidths.reduce((s, w) => s + w.width, 0), { rel: 1e-12 });
    expect(v0.partialWidths.map((w) => w.finalState)).toContain('E- E+');
    const [charged, mixed, leptons, dimuon] = model.channels;
    expect(charged!.kFactor).toBe(1.3);
    expect(mixed!.kind).toBe('charged');
    // Written as [S0bar, S+]: kept in order (charge already +1).
    expect([mixed!.first, mixed!.second]).toEqual([-9000111, 9000211]);
    // Fermion pairs put the fermion first.
    expect([leptons!.first, leptons!.second]).toEqual([9000011, -9000011]);
    expect(dimuon!.scale).toEqual({ kind: 'pair_mass' });
    expect(dimuon!.massRange).toEqual([1000, 1400]);
    expect(charged!.scale).toEqual({ kind: 'average_mass' });
    const ew = electroweakCouplings();
    const photon = charged!.mediators[0]!;
    expectClose(photon.pair.left, ew.e, { rel: 1e-12 });
    expectClose(photon.up.left, (2 / 3) * ew.e, { rel: 1e-12 });
    expect(model.decayTables).toEqual([
      { parent: 9000211, channels: [{ daughters: [-15, 16], branching: 0.6 }, { daughters: [6, -5], branching: 0.4 }] },
      { parent: 9000011, channels: [{ daughters: [15, 23], branching: 1 }] },
    ]);
    expect(model.particles.get(-9000211).charge).toBe(1);
    expect(model.particles.charge(-9000211)).toBe(-1);
  });

  it('loads every demo model file', () => {
    const files = readdirSync(new URL('../../data-demo/', import.meta.url)).filter((f) => f.endsWith('.model.yaml'));
    expect(files.length).toBeGreaterThanOrEqual(2);
    for (const f of files) expect(loadModel(`data-demo/${f}`).channels.length).toBeGreaterThan(0);
  });
});

describe('model files that do not load: one clear located error per kind', () => {
  const cases: [string, string, string, RegExp, string][] = [
    // [from, to, key, message, text on the expected line]
    ['    mass: 300\n', '    mass: 300\n    colour: 3\n', 'particles[0].colour', /unknown key "colour"/, 'colour: 3'],
    ['    mass: 400\n', '    mass: -400\n', 'particles[2].mass', /must be > 0|unexpected/, 'mass: -400'],
    ['    mass: 400\n', '    mass: 1e9\n', 'particles[2].mass', /100000|unexpected/, 'mass: 1e9'],
    ['  - name: E-\n', '  - name: S0\n', 'particles[2].name', /already used by particles\[1\]/, 'name: S0\n    id: 9000011'],
    ['  - name: E-\n', '  - name: tau-\n', 'particles[2].name', /Standard-Model particle name/, 'name: tau-'],
    ['    id: 9000011\n', '    id: 9000111\n', 'particles[2].id', /id 9000111 is already used/, 'id: 9000111\n    spin: 0.5'],
    ['    id: 9000011\n', '    id: 24\n', 'particles[2].id', /Standard-Model particle id/, 'id: 24'],
    ['{ratio: 0.9, of: S+}', '{ratio: 0.9, of: S7}', 'particles[1].mass.of', /unknown state "S7"/, 'ratio: 0.9'],
    ['    mass: 300\n', '    mass: {ratio: 1, of: V0}\n', 'particles[0].mass', /cycle/, 'ratio: 1, of: V0'],
    ['    weak_isospin: -0.5\n', '', 'particles[1].name', /missing Z couplings/, 'name: S0'],
    ['    hypercharge: 0.5\n', '    hypercharge: 0.25\n', 'particles[0].hypercharge', /differs from weak_isospin \+ hypercharge/, 'hypercharge: 0.25'],
    ['    weak_isospin: 0.5\n', '    weak_isospin: 0.3\n', 'particles[0].weak_isospin', /multiple of 1\/2/, 'weak_isospin: 0.3'],
    ['z_couplings: {vector: 0.2, axial: -0.1}', 'z_couplings: {scalar: 0.2}', 'particles[2].z_couplings.scalar', /a fermion takes/, 'z_couplings'],
    ['    weak_isospin: -0.5\n', '    weak_isospin: -0.5\n    z_couplings: {scalar: 1}\n', 'particles[1].z_couplings', /not both/, 'z_couplings: {scalar: 1}'],
    ['    spin: 0.5\n    mass: 400\n', '    spin: 0.5\n    mass: 400\n    width: 500\n', 'particles[2].width', /below the mass/, 'width: 500'],
    ['    spin: 0\n    mass: 300\n', '    spin: 1\n    mass: 300\n', 'particles[0].spin', /expected one of|unexpected/, 'spin: 1'],
    ['{pair: [S+, S-], coupling: 0.5}', '{pair: [S+, X-], coupling: 0.5}', 'resonances[0].pair_couplings[0].pair[1]', /"X-" is not a new particle/, 'pair: [S+, X-]'],
    ['{pair: [S+, S-], coupling: 0.5}', '{pair: [S+, S+], coupling: 0.5}', 'resonances[0].pair_couplings[0].pair', /charge 2|charge 0 or/, 'pair: [S+, S+]'],
    ['{pair: [S+, S-], coupling: 0.5}', '{pair: [S+, S-], left: 0.5}', 'resonances[0].pair_couplings[0]', /scalar pair takes "coupling"/, 'pair: [S+, S-], left'],
    ['{pair: [S+, S-], coupling: 0.5}', '{pair: [S-, S+], coupling: 0.5}\n      - {pair: [S+, S-], coupling: 0.5}', 'resonances[0].pair_couplings[1].pair', /listed twice/, 'pair: [S+, S-], coupling'],
    ['    width: auto\n', '    width: 0.001\n', 'resonances[0].width', /below the sum of its tree-level partial widths/, 'width: 0.001'],
    ['quark_couplings: {left: 0.1, right: 0.1}', 'quark_couplings: {left: 12, right: 12}', 'resonances[0].width', /not below the mass/, 'width: auto'],
    ['quark_couplings: {left: 0.1, right: 0.1}', 'quark_couplings: {left: 13, right: 12}', 'resonances[0].quark_couplings.left', /<= 12\.5/, 'quark_couplings'],
    ['    pair: [S+, S-]\n', '    pair: [S+, S7]\n', 'channels[0].pair[1]', /unknown particle "S7"/, 'pair: [S+, S7]'],
    ['    pair: [S+, S-]\n', '    pair: [S+, mu-]\n', 'channels[0].pair', /either two new particles or two Standard-Model leptons/, 'pair: [S+, mu-]'],
    ['    pair: [S+, S-]\n', '    pair: [S+, E+]\n', 'channels[0].pair', /two scalars or of two fermions/, 'pair: [S+, E+]'],
    ['    pair: [S+, S-]\n', '    pair: [S0, S0]\n', 'channels[0].pair', /particle and its own antiparticle/, 'pair: [S0, S0]'],
    ['    pair: [S0bar, S+]\n', '    pair: [S+, S+]\n', 'channels[1].pair', /charge 2/, 'pair: [S+, S+]'],
    ['    pair: [S+, S-]\n    through: [photon, Z, V0]\n', '    pair: [S0, S0bar]\n    through: [photon, Z, V0]\n', 'channels[0].through[0]', /photon does not couple to a neutral pair/, 'through: [photon, Z, V0]\n    k_factor'],
    ['    through: [W]\n', '    through: [Z]\n', 'channels[1].through[0]', /cannot produce a charged pair/, 'through: [Z]'],
    ['    through: [W]\n', '    through: [W, Zp]\n', 'channels[1].through[1]', /unknown vector "Zp"/, 'through: [W, Zp]'],
    ['    through: [W]\n', '    through: [W, W]\n', 'channels[1].through[1]', /listed twice/, 'through: [W, W]'],
    ['    through: [W]\n', '    through: [V0]\n', 'channels[1].through[0]', /charge 0 but the pair has charge/, 'through: [V0]'],
    ['    mass_range: [1000, 1400]\n', '    mass_range: [2, 1400]\n', 'channels[3].mass_range', /stay above 10 GeV/, 'mass_range: [2, 1400]'],
    ['    through: [photon, Z, V0]\n  - name: dimuon', '    through: [photon, Z, V0]\n    mass_range: [500, 900]\n  - name: dimuon', 'channels[2].mass_range', /below the pair threshold 800 GeV/, 'mass_range: [500, 900]'],
    ['    mass_range: [1000, 1400]\n', '', 'channels[3].pair', /stay above 10 GeV/, 'pair: [mu-, mu+]'],
    ['    mass_range: [1000, 1400]\n', '    mass_range: [1000, 900]\n', 'channels[3].mass_range', /must rise/, 'mass_range: [1000, 900]'],
    ['    k_factor: 1.3\n', '    k_factor: 1.3\n    w_coupling: 2\n', 'channels[0].w_coupling', /only when W is among/, 'w_coupling: 2'],
    ['  - name: leptons\n    pair: [E+, E-]\n', '  - name: charged\n    pair: [E+, E-]\n', 'channels[2].name', /used twice/, 'name: charged\n    pair: [E+'],
    ['    k_factor: 1.3\n', '    k_factor: 0\n', 'channels[0].k_factor', /must be > 0/, 'k_factor: 0'],
    ['  - particle: S+\n', '  - particle: S-\n', 'decays[0].particle', /is an antiparticle/, 'particle: S-'],
    ['  - particle: S+\n', '  - particle: V0\n', 'decays[0].particle', /not a new particle/, 'particle: V0'],
    ['  - particle: E-\n', '  - particle: S+\n', 'decays[1].particle', /two decay tables/, 'particle: S+\n    modes:\n      - {daughters: [tau-'],
    ['[tau+, nu_tau], branching: 0.6', '[tau+, nu_tao], branching: 0.6', 'decays[0].modes[0].daughters[1]', /unknown particle "nu_tao"/, 'nu_tao'],
    ['[tau+, nu_tau], branching: 0.6', '[tau-, nu_tau], branching: 0.6', 'decays[0].modes[0].daughters', /charge is not conserved: S\+ has charge 1, the daughters -1/, 'tau-, nu_tau'],
    ['[t, bbar], branching: 0.4', '[t, g], branching: 0.4', 'decays[0].modes[1].daughters', /charge is not conserved/, '[t, g]'],
    ['[tau-, Z], branching: 1', '[tau-, Z, h], branching: 1', 'decays[1].modes[0].daughters', /at most 2|expected/, '[tau-, Z, h]'],
    ['    mass: 300\n', '    mass: 150\n', 'decays[0].modes[1].daughters', /S\+ \(150 GeV\) is lighter than its daughters \(177\.270 GeV\)/, '[t, bbar]'],
    ['[t, bbar], branching: 0.4', '[tau+, nu_tau], branching: 0.4', 'decays[0].modes[1].daughters', /listed twice/, '[tau+, nu_tau], branching: 0.4'],
    ['[t, bbar], branching: 0.4', '[t, bbar], branching: 0.3', 'decays[0].modes', /branching fractions of S\+ sum to 0\.9000000000, not 1/, '- {daughters: [tau+'],
    ['[tau-, Z], branching: 1', '[E-, Z], branching: 1', 'decays[1].modes[0].daughters[0]', /cannot decay to itself/, '[E-, Z]'],
    ['[tau-, Z], branching: 1', '[tau-, g], branching: 1', 'decays[1].modes[0].daughters', /colour is not conserved/, '[tau-, g]'],
  ];
  for (const [from, to, key, message, lineText] of cases) {
    it(`${key}: ${message.source}`, () => {
      const e = errorFor(from, to);
      expect(e.file).toBe('m.model.yaml');
      expect(e.message).toMatch(message);
      if (e.code !== 'schema' || !/not valid YAML/.test(e.message)) expect(e.key).toBe(key);
      expect(e.line).toBe(lineOf(lineText, from, to));
      expect(e.column).toBeGreaterThan(0);
      expect(formatError(e)).toMatch(/^m\.model\.yaml:\d+:\d+: /);
    });
  }

  it('names the file when it does not exist', () => {
    expect(() => loadModel('no/such.model.yaml')).toThrow(TamisError);
    try {
      loadModel('no/such.model.yaml');
    } catch (e) {
      expect(formatError(e)).toBe('no/such.model.yaml: file not found');
    }
  });
});

describe('closed decay modes in mass scans', () => {
  it('closed_modes: rescale_open drops a closed mode and scales the open ones to sum to 1', () => {
    const text = BASE.replace('    mass: 300\n', '    mass: 150\n').replace('  - particle: S+\n    modes:\n', '  - particle: S+\n    closed_modes: rescale_open\n    modes:\n');
    const model = parseModel(text, 'scan-point.model.yaml');
    const table = model.decayTables.find((t) => t.parent === 9000211)!;
    expect(table.channels).toHaveLength(1);
    expect(table.channels[0]!.daughters).toEqual([-15, 16]);
    expect(table.channels[0]!.branching).toBe(1);
    expect(table.closedModes).toEqual(['t bbar']);
  });
  it('keeps the tables unchanged when every mode is open', () => {
    const text = BASE.replace('  - particle: S+\n    modes:\n', '  - particle: S+\n    closed_modes: rescale_open\n    modes:\n');
    const table = parseModel(text, 'a.model.yaml').decayTables.find((t) => t.parent === 9000211)!;
    expect(table.channels.map((c) => c.branching)).toEqual([0.6, 0.4]);
    expect(table.closedModes).toBeUndefined();
  });
  it('suggests rescale_open when a mode is closed', () => {
    expect(() => parseModel(BASE.replace('    mass: 300\n', '    mass: 150\n'), 'a.model.yaml')).toThrow(TamisError);
    try {
      parseModel(BASE.replace('    mass: 300\n', '    mass: 150\n'), 'a.model.yaml');
    } catch (error) {
      expect((error as TamisError).suggestion).toMatch(/closed_modes: rescale_open/);
    }
  });
});
