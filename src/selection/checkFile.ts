/**
 * `tamis check`: validates one user file of any kind tamis reads and says
 * what it is. The kind comes from the file name, then from the folder, then
 * from the top-level keys:
 *
 *   *.model.yaml                      model
 *   *.scan.yaml                       refused here (scans are checked by recast/checkAnyFile.ts)
 *   a file inside a `detectors/` folder detector profile
 *   top-level key `regions`           analysis
 *   top-level key `collider_energy_tev` detector profile
 *   anything else                     analysis (its schema then says what is missing)
 */
import { basename, dirname } from 'node:path';
import { parseDocument } from 'yaml';
import { TamisError } from '../errors.js';
import { readTextFile } from '../io/yamlFile.js';
import { parseAnalysis } from './loader.js';

export type CheckedKind = 'analysis' | 'detector profile' | 'model';

export interface CheckOutcome {
  file: string;
  kind: CheckedKind;
  /** One line naming the file's content, e.g. `three-lepton-8tev, 8 TeV, 20.3 fb^-1, 4 steps, 36 regions`. */
  summary: string;
}

/** The kind of a file, from its name, folder or top-level keys (see the module comment). */
export function fileKindOf(file: string, text: string): CheckedKind {
  if (basename(file).endsWith('.model.yaml') || basename(file).endsWith('.model.yml')) return 'model';
  if (/\.scan\.ya?ml$/.test(basename(file))) {
    throw new TamisError('bad_input', 'tamis check reads analysis, detector-profile and model files, not scan files (*.scan.yaml)', { file });
  }
  if (basename(dirname(file)) === 'detectors') return 'detector profile';
  let keys: string[] = [];
  try {
    const data: unknown = parseDocument(text).toJS({ maxAliasCount: 100 });
    if (data !== null && typeof data === 'object' && !Array.isArray(data)) keys = Object.keys(data);
  } catch {
    // Unparsable: the analysis loader will report the YAML error with its location.
  }
  if (keys.includes('regions')) return 'analysis';
  if (keys.includes('collider_energy_tev')) return 'detector profile';
  return 'analysis';
}

/**
 * Checks one file: reads it with the loader of its kind (which throws a
 * located `TamisError` on any problem) and summarises it.
 *
 * @example
 * (await checkFile('analyses/same-sign-8tev.yaml')).summary
 * // 'same-sign-8tev, 8 TeV, 20.3 fb^-1, 6 steps, 18 regions, detector generic-8tev.yaml, invented numbers'
 */
export async function checkFile(file: string): Promise<CheckOutcome> {
  const text = readTextFile(file);
  const kind = fileKindOf(file, text);
  switch (kind) {
    case 'model': {
      const { parseModel } = await import('../generator/model/index.js');
      const model = parseModel(text, file);
      const particles = model.newParticles.map((p) => p.name).join(', ');
      return { file, kind, summary: `${model.name}, new particles ${particles || 'none'}, ${model.channels.length} production channel${model.channels.length === 1 ? '' : 's'}` };
    }
    case 'detector profile': {
      const { parseDetectorProfile } = await import('../detector/profile/loader.js');
      const profile = parseDetectorProfile(text, file);
      return { file, kind, summary: `${profile.name}, ${profile.colliderEnergyTev} TeV` };
    }
    case 'analysis': {
      const a = parseAnalysis(text, file);
      if (a.referenceCutflow !== undefined) {
        // The benchmark model of a reference cut-flow must itself be a valid model file.
        const { loadModel } = await import('../generator/model/index.js');
        loadModel(a.referenceCutflow.modelFile);
      }
      const invented = a.invented ? ', invented numbers' : '';
      return {
        file,
        kind,
        summary: `${a.id}, ${a.energyTev} TeV, ${a.luminosityIfb} fb^-1, ${a.steps.length} step${a.steps.length === 1 ? '' : 's'}, ${a.regions.length} region${a.regions.length === 1 ? '' : 's'}, detector ${basename(a.detectorFile)}${invented}`,
      };
    }
  }
}
