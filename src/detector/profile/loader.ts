/**
 * Reading detector-profile files: YAML through the shared loader (errors with
 * file, line, column and key), then the checks the schema cannot express, then
 * resolution into lookup tables.
 */
import { parseYamlText, readTextFile } from '../../io/yamlFile.js';
import { resolveDetectorProfile, type DetectorProfile } from './detectorProfile.js';
import { checkDetectorProfile } from './profileChecks.js';
import { DetectorProfileSchema } from './schema.js';

/**
 * Parses and validates the text of a detector-profile file; `file` is used in messages.
 *
 * @throws TamisError (code `schema` or `bad_file`) naming file, line, column and key of the first problem
 * @example
 * parseDetectorProfile(readFileSync('analyses/detectors/generic-8tev.yaml', 'utf8'), 'generic-8tev.yaml').name // 'generic-8tev'
 */
export function parseDetectorProfile(text: string, file: string): DetectorProfile {
  const source = parseYamlText(text, file, DetectorProfileSchema);
  checkDetectorProfile(source.data, source.locate);
  return resolveDetectorProfile(source.data, file);
}

/**
 * Reads a detector-profile file.
 *
 * @throws TamisError when the file cannot be read or is not a valid profile (message names file, line and key)
 * @example
 * loadDetectorProfile('analyses/detectors/generic-13tev.yaml').colliderEnergyTev // 13
 */
export function loadDetectorProfile(path: string): DetectorProfile {
  return parseDetectorProfile(readTextFile(path), path);
}
