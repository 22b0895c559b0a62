/**
 * Loading a model file: YAML + schema (located errors from io/yamlFile), then
 * resolution into a `Model` with every cross-reference checked. Every problem
 * is a `TamisError` naming file, line, column and key.
 */
import { TamisError } from '../../errors.js';
import { parseYamlText, readTextFile, type YamlSource } from '../../io/yamlFile.js';
import { electroweakCouplings } from '../electroweak.js';
import { ParticleTable } from '../particles.js';
import { ParticleNames } from './particleNames.js';
import { resolveChannels } from './resolveChannels.js';
import { ResolveContext, resolveMasses } from './resolveContext.js';
import { resolveDecays } from './resolveDecays.js';
import { checkNamesAndIds, resolveNewParticles } from './resolveParticles.js';
import { resolveResonances } from './resolveResonances.js';
import { modelFileSchema, type ModelFile } from './schema.js';
import type { Model } from './types.js';

/**
 * Reads and resolves a model file.
 *
 * @example
 * loadModel('data-demo/benchmark.model.yaml').channels.map((c) => c.name)
 * // ['charged_pair', 'neutral_pair', 'mixed_pair']
 */
export function loadModel(path: string): Model {
  return parseModel(readTextFile(path), path);
}

/** Parses and resolves model-file text; `file` is used in messages and kept in `Model.file`. */
export function parseModel(text: string, file: string): Model {
  return resolveModel(parseYamlText(text, file, modelFileSchema));
}

/** Resolves a validated model file (defaults applied) into a `Model`. */
export function resolveModel(source: Pick<YamlSource<ModelFile>, 'data' | 'file' | 'locate'>): Model {
  const context = new ResolveContext(source);
  const file = source.data;
  checkNamesAndIds(file, context);
  const couplings = electroweakCouplings(file.electroweak_scheme);
  const masses = resolveMasses(file, context);
  const newParticles = resolveNewParticles(file, masses, context, couplings.sin2W);
  const particles = new ParticleTable();
  const names = new ParticleNames(particles);
  for (const p of newParticles) {
    particles.add({ id: p.id, name: p.name, mass: p.mass, width: p.width, charge: p.charge, twiceSpin: 2 * p.spin, colour: 1, selfConjugate: false });
    names.set(p.name, p.id);
    names.set(p.antiName, -p.id);
  }
  const newIds = new Set(newParticles.map((p) => p.id));
  const resonances = resolveResonances(file, masses, names, particles, newIds, context);
  const channels = resolveChannels(file, { couplings, table: particles, names, newParticles, resonances, context });
  const decayTables = resolveDecays(file, newParticles, names, particles, context);
  const model: Model = {
    name: file.name,
    description: file.description ?? '',
    file: source.file,
    couplings,
    particles,
    newParticles,
    resonances,
    channels,
    decayTables,
  };
  checkFinite(model);
  return model;
}

/** Guards against non-finite numbers slipping through (a bug, not a user error). */
function checkFinite(model: Model): void {
  const bad = (x: number): boolean => !Number.isFinite(x);
  for (const r of model.resonances) if (bad(r.width) || bad(r.mass)) throw new TamisError('internal', `resonance ${r.name} has a non-finite mass or width`, { file: model.file });
  for (const c of model.channels) {
    for (const m of c.mediators) {
      if ([m.mass, m.width, m.up.left, m.up.right, m.down.left, m.down.right, m.pair.left, m.pair.right].some(bad)) {
        throw new TamisError('internal', `channel ${c.name}: non-finite coupling of ${m.name}`, { file: model.file });
      }
    }
  }
}
