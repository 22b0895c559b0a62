/**
 * Reading analysis files: YAML and schema checks (through io/yamlFile), then
 * the checks a schema cannot express, each error located at file, line,
 * column and key: cut expressions that do not parse or name unknown
 * variables, duplicate names, correlation groups and reference cut-flows
 * naming things that do not exist, files that are not there.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { builtInDetectorFolder, builtInDetectorProfileNames } from '../detector/profile/builtInProfiles.js';
import { loadDetectorProfile } from '../detector/profile/loader.js';
import { TamisError } from '../errors.js';
import { editDistance, parseYamlText, readTextFile, type KeyPath, type YamlSource } from '../io/yamlFile.js';
import type { Analysis, Cut, SignalRegion } from './analysis.js';
import { variablesOf } from './expression/ast.js';
import { offsetOf } from './expression/lexer.js';
import { parseExpression } from './expression/parser.js';
import { resolveObjects } from './objectDefaults.js';
import { AnalysisFileSchema, type AnalysisFile } from './schema.js';
import { variableNames, variableSlot } from './variables.js';

export interface LoadOptions {
  /** Check that the detector profile and benchmark model files exist (default true). */
  checkFiles?: boolean;
}

type Source = YamlSource<AnalysisFile>;

/** "did you mean" hint for an unknown variable, followed by the list of known ones. */
function unknownVariableHint(name: string): string {
  const known = variableNames();
  let best = known[0]!;
  let bestDistance = Infinity;
  for (const k of known) {
    const d = editDistance(name.toLowerCase(), k);
    if (d < bestDistance) {
      bestDistance = d;
      best = k;
    }
  }
  const nearest = bestDistance <= Math.max(2, Math.floor(name.length / 3)) ? `did you mean "${best}"? ` : '';
  return `${nearest}known variables: ${known.join(', ')}`;
}

/** Parses one cut expression at `path`, turning its errors into located ones. */
function parseCut(src: Source, path: KeyPath, text: string): Cut {
  let expression;
  try {
    expression = parseExpression(text);
  } catch (error) {
    if (error instanceof TamisError) throw error.withLocation(src.locate(path, offsetOf(error)));
    throw error;
  }
  for (const name of variablesOf(expression)) {
    if (variableSlot(name) < 0) {
      const offset = findVariableOffset(expression, name);
      throw new TamisError('expression', `unknown variable "${name}" at column ${offset + 1}`, { ...src.locate(path, offset), suggestion: unknownVariableHint(name) });
    }
  }
  return { text, expression, location: src.locate(path) };
}

function findVariableOffset(node: ReturnType<typeof parseExpression>, name: string): number {
  switch (node.kind) {
    case 'and':
    case 'or': {
      const left = findVariableOffset(node.left, name);
      return left >= 0 ? left : findVariableOffset(node.right, name);
    }
    case 'not':
      return findVariableOffset(node.operand, name);
    default:
      return node.variable === name ? node.variableStart : -1;
  }
}

function fail(src: Source, path: KeyPath, message: string, suggestion?: string): never {
  throw new TamisError('schema', message, { ...src.locate(path), ...(suggestion === undefined ? {} : { suggestion }) });
}

function checkFileExists(src: Source, path: KeyPath, written: string, what: string): string {
  const resolved = resolve(dirname(src.file), written);
  if (!existsSync(resolved)) fail(src, path, `${what} not found: ${resolved}`, 'paths are relative to the folder of the analysis file');
  if (!statSync(resolved).isFile()) fail(src, path, `${what} is not a file: ${resolved}`);
  return resolved;
}

/**
 * The detector profile of the analysis: a `.yaml` path relative to the
 * analysis file, or the name of a profile shipped in analyses/detectors/.
 * With `checkFiles`, the profile is loaded (its own errors point into it) and
 * its collider energy must match the analysis's.
 */
function resolveDetector(src: Source, checkFiles: boolean): string {
  const written = src.data.detector;
  const isPath = /\.ya?ml$/.test(written);
  if (!checkFiles) return isPath ? resolve(dirname(src.file), written) : written;
  let path: string;
  if (isPath) path = checkFileExists(src, ['detector'], written, 'detector profile');
  else {
    const names = builtInDetectorProfileNames();
    if (!names.includes(written)) fail(src, ['detector'], `unknown detector profile "${written}"`, `shipped profiles: ${names.join(', ')}; or give a path ending in .yaml, relative to the analysis file`);
    path = join(builtInDetectorFolder(), `${written}.yaml`);
  }
  const profile = profileSummary(path);
  if (Math.abs(profile.energyTev - src.data.energy_tev) > 1e-9) {
    fail(src, ['detector'], `detector profile "${profile.name}" is for ${profile.energyTev} TeV but the analysis is at ${src.data.energy_tev} TeV`, 'use a profile of the same collider era');
  }
  return path;
}

/** Name and energy of validated profiles, by path, size and modification time: many analyses share one profile. */
const profileCache = new Map<string, { stamp: string; name: string; energyTev: number }>();

function profileSummary(path: string): { name: string; energyTev: number } {
  const stat = statSync(path);
  const stamp = `${stat.size}:${stat.mtimeMs}`;
  const cached = profileCache.get(path);
  if (cached !== undefined && cached.stamp === stamp) return cached;
  const profile = loadDetectorProfile(path);
  const summary = { stamp, name: profile.name, energyTev: profile.colliderEnergyTev };
  profileCache.set(path, summary);
  return summary;
}

function resolveRegions(src: Source): SignalRegion[] {
  const seen = new Map<string, number>();
  return src.data.regions.map((r, i) => {
    const first = seen.get(r.name);
    if (first !== undefined) fail(src, ['regions', i, 'name'], `duplicate region name "${r.name}" (first used by regions[${first}] at line ${src.locate(['regions', first]).line ?? '?'})`);
    seen.set(r.name, i);
    const region: SignalRegion = {
      name: r.name,
      cuts: r.cuts.map((text, k) => parseCut(src, ['regions', i, 'cuts', k], text)),
      observed: r.observed,
      background: r.background,
      backgroundUncertainty: r.background_uncertainty,
      location: src.locate(['regions', i]),
    };
    if (r.n95_observed !== undefined) region.n95Observed = r.n95_observed;
    if (r.n95_expected !== undefined) region.n95Expected = r.n95_expected;
    return region;
  });
}

function checkCorrelationGroups(src: Source, regionNames: ReadonlySet<string>): void {
  const owner = new Map<string, string>();
  const groupNames = new Set<string>();
  (src.data.correlation_groups ?? []).forEach((g, i) => {
    if (groupNames.has(g.name)) fail(src, ['correlation_groups', i, 'name'], `duplicate correlation group name "${g.name}"`);
    groupNames.add(g.name);
    g.regions.forEach((name, k) => {
      const path = ['correlation_groups', i, 'regions', k];
      if (!regionNames.has(name)) fail(src, path, `correlation group "${g.name}" names unknown region "${name}"`, nearestName(name, regionNames));
      const other = owner.get(name);
      if (other !== undefined) fail(src, path, `region "${name}" is already in correlation group "${other}": a region belongs to at most one group`);
      owner.set(name, g.name);
    });
  });
}

function nearestName(name: string, names: ReadonlySet<string>): string {
  let best = '';
  let bestDistance = Infinity;
  for (const n of names) {
    const d = editDistance(name, n);
    if (d < bestDistance) {
      bestDistance = d;
      best = n;
    }
  }
  return bestDistance <= Math.max(2, Math.floor(name.length / 3)) ? `did you mean "${best}"?` : `known: ${[...names].slice(0, 12).join(', ')}${names.size > 12 ? ', ...' : ''}`;
}

function resolveReference(src: Source, stepNames: readonly string[], regionNames: ReadonlySet<string>, checkFiles: boolean): Analysis['referenceCutflow'] {
  const ref = src.data.reference_cutflow;
  if (ref === undefined) return undefined;
  let previous = -1;
  ref.steps.forEach((s, i) => {
    const index = stepNames.indexOf(s.step);
    const path = ['reference_cutflow', 'steps', i, 'step'];
    if (index < 0) fail(src, path, `reference cut-flow names unknown step "${s.step}"`, `steps of this analysis: ${stepNames.map((n) => `"${n}"`).join(', ')}`);
    if (index <= previous) fail(src, path, `reference cut-flow lists step "${s.step}" out of order: list steps in the order of the steps section`);
    previous = index;
  });
  (ref.regions ?? []).forEach((r, i) => {
    if (!regionNames.has(r.region)) fail(src, ['reference_cutflow', 'regions', i, 'region'], `reference cut-flow names unknown region "${r.region}"`, nearestName(r.region, regionNames));
  });
  const modelFile = checkFiles ? checkFileExists(src, ['reference_cutflow', 'model'], ref.model, 'benchmark model file') : resolve(dirname(src.file), ref.model);
  return { modelFile, source: ref.source, eventsBeforeCuts: ref.events_before_cuts, steps: ref.steps, regions: ref.regions ?? [] };
}

/**
 * Parses and checks analysis-file text; `file` is used in messages and to
 * resolve relative paths. Throws a located `TamisError` on any problem.
 */
export function parseAnalysis(text: string, file: string, options: LoadOptions = {}): Analysis {
  const checkFiles = options.checkFiles ?? true;
  const src = parseYamlText(text, file, AnalysisFileSchema);
  const d = src.data;
  const stepNames: string[] = [];
  const steps = (d.steps ?? []).map((s, i) => {
    if (stepNames.includes(s.name)) fail(src, ['steps', i, 'name'], `duplicate step name "${s.name}"`);
    stepNames.push(s.name);
    return { name: s.name, cut: parseCut(src, ['steps', i, 'cut'], s.cut) };
  });
  const regions = resolveRegions(src);
  const regionNames = new Set(regions.map((r) => r.name));
  checkCorrelationGroups(src, regionNames);
  const detectorFile = resolveDetector(src, checkFiles);
  const analysis: Analysis = {
    id: d.id,
    summary: d.summary,
    invented: d.invented ?? false,
    file,
    location: src.locate(['id']),
    energyTev: d.energy_tev,
    luminosityIfb: d.luminosity_ifb,
    detectorFile,
    objects: resolveObjects(d.objects),
    steps,
    regions,
    regionsDisjoint: d.regions_disjoint ?? true,
    correlationGroups: (d.correlation_groups ?? []).map((g) => ({ name: g.name, regions: [...g.regions] })),
  };
  if (d.reference !== undefined) analysis.reference = d.reference;
  const reference = resolveReference(src, stepNames, regionNames, checkFiles);
  if (reference !== undefined) analysis.referenceCutflow = reference;
  return analysis;
}

/**
 * Reads and checks one analysis file.
 *
 * @example
 * loadAnalysis('analyses/three-lepton-8tev.yaml').regions.length // 36
 */
export function loadAnalysis(file: string, options: LoadOptions = {}): Analysis {
  return parseAnalysis(readTextFile(file), file, options);
}

/**
 * Reads several analyses. A folder stands for the `*.yaml` files directly
 * inside it (sub-folders such as `detectors/` are not read). Two analyses
 * with one id are an error.
 */
export function loadAnalyses(paths: readonly string[], options: LoadOptions = {}): Analysis[] {
  const files: string[] = [];
  for (const path of paths) {
    let isFolder = false;
    try {
      isFolder = statSync(path).isDirectory();
    } catch {
      throw new TamisError('bad_file', 'file not found', { file: path });
    }
    if (isFolder) {
      const inside = readdirSync(path).filter((f) => f.endsWith('.yaml') || f.endsWith('.yml')).sort();
      if (inside.length === 0) throw new TamisError('bad_file', 'folder holds no analysis files (*.yaml)', { file: path });
      files.push(...inside.map((f) => join(path, f)));
    } else {
      files.push(path);
    }
  }
  const analyses: Analysis[] = [];
  const ids = new Map<string, string>();
  for (const file of files) {
    const analysis = loadAnalysis(file, options);
    const other = ids.get(analysis.id);
    if (other !== undefined) throw new TamisError('schema', `analysis id "${analysis.id}" is also used by ${other}`, analysis.location);
    ids.set(analysis.id, file);
    analyses.push(analysis);
  }
  return analyses;
}
