/**
 * Reading a scan file: axes, derived parameters and every point's model,
 * all checked before anything runs, with errors that name the scan file's
 * line and key (or the point and the model's line for a point whose model
 * does not hold, e.g. a decay that closes at a scanned mass).
 */
import { dirname, resolve } from 'node:path';
import { TamisError } from '../../errors.js';
import { parseModel } from '../../generator/model/loader.js';
import { parseYamlText, readTextFile, type YamlSource } from '../../io/yamlFile.js';
import type { Analysis } from '../../selection/analysis.js';
import { loadAnalyses } from '../../selection/loader.js';
import { VERSION } from '../../version.js';
import { sha256 } from '../eventChunks.js';
import { energiesToRun } from '../recastPoint.js';
import { FormulaError, parseFormula, type ParsedFormula } from './arithmetic.js';
import { ModelTemplate, type ConcretePath } from './modelPaths.js';
import { ScanFileSchema, type ScanFile } from './schema.js';

export interface ScanAxis {
  name: string;
  unit: string;
  values: number[];
}

export interface ScanPoint {
  /** Position in the grid (the last axis varies fastest). */
  index: number;
  parameters: Record<string, number>;
  modelText: string;
}

export interface Scan {
  file: string;
  name: string;
  description: string;
  modelFile: string;
  analyses: Analysis[];
  energies: number[];
  events: number;
  seed: number;
  precision: number;
  limits: ScanFile['limits'];
  axes: ScanAxis[];
  points: ScanPoint[];
  /** SHA-256 of everything that decides the results: checkpoints from other inputs are not reused. */
  fingerprint: string;
}

function axisValues(source: YamlSource<ScanFile>, i: number): number[] {
  const axis = source.data.parameters[i]!;
  if ((axis.values === undefined) === (axis.range === undefined)) {
    throw new TamisError('schema', `give either values or range for parameter ${axis.name}`, source.locate(['parameters', i]));
  }
  if (axis.values) return axis.values;
  const { from, to, points } = axis.range!;
  return Array.from({ length: points }, (_, k) => Number((from + ((to - from) * k) / (points - 1)).toPrecision(12)));
}

/** Reads and checks a scan file and builds every point's model text. */
export function loadScan(file: string): Scan {
  return parseScan(readTextFile(file), file);
}

/** Checks a scan file's text (`file` locates relative paths and names the file in errors). */
export function parseScan(text: string, file: string): Scan {
  const source = parseYamlText(text, file, ScanFileSchema);
  const scan = source.data;
  const folder = dirname(file);
  const modelFile = resolve(folder, scan.model);
  let modelText: string;
  try {
    modelText = readTextFile(modelFile);
  } catch (error) {
    throw error instanceof TamisError ? error.withLocation(source.locate(['model'])) : error;
  }
  // The base model must itself be valid: its errors point into the model file.
  parseModel(modelText, modelFile);
  const analysisPaths = scan.analyses.map((p) => resolve(folder, p));
  const analyses = loadAnalyses(analysisPaths);
  let energies: number[];
  try {
    energies = energiesToRun(analyses, scan.energies);
  } catch (error) {
    throw new TamisError('schema', (error as Error).message, source.locate(['energies']));
  }
  const axes: ScanAxis[] = scan.parameters.map((a, i) => ({ name: a.name, unit: a.unit, values: axisValues(source, i) }));
  const names = new Set<string>();
  for (const [i, a] of scan.parameters.entries()) {
    if (names.has(a.name)) throw new TamisError('schema', `parameter ${a.name} is defined twice`, source.locate(['parameters', i, 'name']));
    names.add(a.name);
  }
  for (const c of Object.keys(scan.constants)) {
    if (names.has(c)) throw new TamisError('schema', `constant ${c} has the name of a parameter`, source.locate(['constants', c]));
    names.add(c);
  }
  const template = new ModelTemplate(modelText);
  const pathAt = (keys: (string | number)[], path: string): ConcretePath => {
    try {
      return template.resolve(path);
    } catch (error) {
      throw new TamisError('schema', (error as Error).message, { ...source.locate(keys), suggestion: `paths go into ${scan.model}, e.g. particles.<name>.mass` });
    }
  };
  const axisPaths = scan.parameters.map((a, i) => a.set.map((p, j) => pathAt(['parameters', i, 'set', j], p)));
  const formulas: { formula: ParsedFormula; paths: ConcretePath[] }[] = scan.derived.map((d, i) => {
    let formula: ParsedFormula;
    try {
      formula = parseFormula(d.formula, [...names]);
    } catch (error) {
      if (error instanceof FormulaError) throw new TamisError('expression', error.message, source.locate(['derived', i, 'formula'], error.offset));
      throw error;
    }
    return { formula, paths: d.set.map((p, j) => pathAt(['derived', i, 'set', j], p)) };
  });
  // A value set twice, or inside another value the scan sets, has no single meaning.
  const allPaths = [
    ...axisPaths.flatMap((paths, i) => paths.map((path, j) => ({ path, text: scan.parameters[i]!.set[j]!, at: ['parameters', i, 'set', j] as (string | number)[] }))),
    ...formulas.flatMap((f, i) => f.paths.map((path, j) => ({ path, text: scan.derived[i]!.set[j]!, at: ['derived', i, 'set', j] as (string | number)[] }))),
  ];
  for (const [a, first] of allPaths.entries()) {
    for (const second of allPaths.slice(a + 1)) {
      const [short, long] = first.path.length <= second.path.length ? [first, second] : [second, first];
      if (short.path.every((p, k) => long.path[k] === p)) {
        const what = short.path.length === long.path.length ? `${second.text} is set twice` : `${long.text} lies inside ${short.text}, which the scan also sets`;
        throw new TamisError('schema', what, source.locate(second.at));
      }
    }
  }
  const points: ScanPoint[] = [];
  const grid = axes.length === 1 ? axes[0]!.values.map((v) => [v]) : axes[0]!.values.flatMap((v) => axes[1]!.values.map((w) => [v, w]));
  for (const [index, values] of grid.entries()) {
    const parameters: Record<string, number> = {};
    axes.forEach((a, k) => (parameters[a.name] = values[k]!));
    const scope = { ...scan.constants, ...parameters };
    const assignments = axisPaths.flatMap((paths, k) => paths.map((path) => ({ path, value: values[k]! })));
    for (const [i, d] of formulas.entries()) {
      const value = d.formula.evaluate(scope);
      if (!Number.isFinite(value)) {
        throw new TamisError('schema', `formula gives ${value} at ${describePoint(parameters)}`, source.locate(['derived', i, 'formula']));
      }
      for (const path of d.paths) assignments.push({ path, value: Number(value.toPrecision(12)) });
    }
    const text = template.withValues(assignments);
    try {
      parseModel(text, modelFile);
    } catch (error) {
      if (error instanceof TamisError) {
        throw new TamisError(error.code, `scan point ${index} (${describePoint(parameters)}): ${error.message}`, {
          ...(error.file === undefined ? {} : { file: error.file }),
          ...(error.line === undefined ? {} : { line: error.line }),
          ...(error.column === undefined ? {} : { column: error.column }),
          ...(error.key === undefined ? {} : { key: error.key }),
          suggestion: error.suggestion ?? 'change the scan range or the model so every point is valid',
        });
      }
      throw error;
    }
    points.push({ index, parameters, modelText: text });
  }
  const fingerprint = sha256(
    JSON.stringify({
      version: VERSION,
      scan: text,
      model: modelText,
      analyses: analyses.map((a) => [a.id, readTextFile(a.file), readTextFile(a.detectorFile)]),
    }),
  );
  return {
    file,
    name: scan.name,
    description: scan.description ?? '',
    modelFile,
    analyses,
    energies,
    events: scan.events,
    seed: scan.seed,
    precision: scan.precision,
    limits: scan.limits,
    axes,
    points,
    fingerprint,
  };
}

export function describePoint(parameters: Record<string, number>): string {
  return Object.entries(parameters)
    .map(([k, v]) => `${k} = ${v}`)
    .join(', ');
}
