/**
 * summary.json of a recast: the whole result with the inputs that made it
 * (files and their SHA-256, seeds, settings, versions), so a reader can tell
 * exactly what was run. No time stamps: the same inputs give the same bytes.
 */
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import type { PointResult } from '../recast/types.js';
import { VERSION } from '../version.js';

export interface RunInputs {
  /** Command line that produced the result, for the record. */
  command: string;
  modelFile: string;
  analysisFiles: readonly string[];
  detectorFiles: readonly string[];
  settings: Record<string, string | number | boolean | readonly number[]>;
}

/** SHA-256 of a file's bytes (hex), or "missing" when it cannot be read. */
export function fileSha256(file: string): string {
  try {
    return createHash('sha256').update(readFileSync(file)).digest('hex');
  } catch {
    return 'missing';
  }
}

/** Finite numbers as they are; NaN and infinities as strings (JSON has no such numbers). */
function jsonSafe(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return Number.isNaN(value) ? 'NaN' : value > 0 ? 'Infinity' : '-Infinity';
  return value;
}

export function summaryJson(result: PointResult, inputs: RunInputs): string {
  const document = {
    tamis_version: VERSION,
    node_version: process.versions.node,
    caution: 'Approximate reinterpretation with a leading-order parton-level generator and a parametrised detector; confirm any exclusion with the experiments\u2019 own tools and full simulation before publishing.',
    command: inputs.command,
    inputs: {
      model: { file: inputs.modelFile, sha256: result.model.sha256 },
      analyses: inputs.analysisFiles.map((file) => ({ file, sha256: fileSha256(file) })),
      detector_profiles: inputs.detectorFiles.map((file) => ({ file, sha256: fileSha256(file) })),
    },
    settings: inputs.settings,
    result,
  };
  return `${JSON.stringify(document, jsonSafe, 2)}\n`;
}
