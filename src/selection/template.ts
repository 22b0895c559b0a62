/**
 * `tamis new-analysis`: a commented starting file that passes `tamis check`
 * as written, so a user edits a working analysis instead of a blank page.
 */
import { existsSync, linkSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { TamisError } from '../errors.js';
import { temporaryPathFor } from '../io/atomicWrite.js';

/** Analysis ids: what the schema accepts. */
const ID_PATTERN = /^[a-z0-9][a-z0-9_-]*$/;

/**
 * The text of a new analysis file.
 *
 * @throws TamisError (`bad_input`) for an id the analysis schema would refuse
 * @example
 * analysisTemplate('my-search', 13).startsWith('# my-search') // true
 */
export function analysisTemplate(id: string, energyTev: 8 | 13 = 13): string {
  if (!ID_PATTERN.test(id) || id.length > 80) {
    throw new TamisError('bad_input', `analysis id "${id}" must use lower-case letters, digits, _ and - (at most 80 characters)`, { key: 'ID', suggestion: 'for example three-lepton-13tev' });
  }
  const luminosity = energyTev === 8 ? 20.3 : 139;
  return `# ${id}: a tamis analysis definition (format: analyses/README.md).
# Check it after every edit with: tamis check <this file>
#
# The selection, counts and uncertainties below are a starting example:
# REPLACE them with those of the publication you re-implement.

id: ${id}
summary: Three or more leptons and missing transverse momentum at ${energyTev} TeV (starting example)
# reference: arXiv:0000.00000        # the publication you re-implement
energy_tev: ${energyTev}              # proton-proton centre-of-mass energy, TeV
luminosity_ifb: ${luminosity}          # integrated luminosity, fb^-1
detector: generic-${energyTev}tev    # a shipped profile, or a path to a profile .yaml relative to this file

# Object definitions: every key is optional (defaults in analyses/README.md).
objects:
  electrons: {min_pt: 10, max_abs_eta: 2.47, max_relative_isolation: 0.15}
  muons: {min_pt: 10, max_abs_eta: 2.5, max_relative_isolation: 0.15}
  taus: {min_pt: 20, max_abs_eta: 2.5}
  jets: {min_pt: 30, max_abs_eta: 2.5}
  b_jets: {min_pt: 30, max_abs_eta: 2.5}
  isolation_cone: 0.3
  overlap_removal: {taus_near_leptons: 0.2, jets_near_leptons: 0.2, jets_near_taus: 0.2, leptons_near_jets: 0.4}

# Ordered selection steps: the rows of the cut-flow. Cut expressions compare a
# variable with numbers (list: tamis variables) and combine comparisons with
# and, or, not and parentheses, e.g. "50 <= met < 100 and not n_bjets >= 1".
steps:
  - name: three light leptons
    cut: n_leptons >= 3
  - name: leading lepton above 25 GeV
    cut: lep1_pt > 25
  - name: b-jet veto
    cut: n_bjets == 0

# Signal regions: all cuts of a region apply after the steps. observed,
# background and background_uncertainty (total, in events) come from the
# publication; n95_observed / n95_expected (published 95% CL limits on signal
# events) are optional cross-checks.
regions_disjoint: true
regions:
  - name: sr-onz
    cuts: [n_sfos >= 1, 81.2 < mll_z < 101.2, met >= 100]
    observed: 12            # REPLACE
    background: 10.4        # REPLACE
    background_uncertainty: 2.1   # REPLACE
  - name: sr-offz
    cuts: [not 81.2 < mll_z < 101.2, met >= 100]
    observed: 3             # REPLACE
    background: 2.6         # REPLACE
    background_uncertainty: 0.9   # REPLACE

# Optional: regions whose background uncertainties are fully correlated.
# correlation_groups:
#   - name: same background method
#     regions: [sr-onz, sr-offz]
`;
}

/**
 * Writes a new analysis file, refusing to replace an existing one. The file
 * appears complete or not at all (written beside, then hard-linked into place,
 * which fails if the name is taken).
 */
export function writeNewAnalysis(file: string, text: string): void {
  if (existsSync(file)) throw new TamisError('bad_input', 'file exists already: tamis new-analysis never overwrites a file', { file, suggestion: 'choose another name with --out' });
  const tmp = temporaryPathFor(file);
  try {
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(tmp, text);
    linkSync(tmp, file);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') throw new TamisError('bad_input', 'file exists already: tamis new-analysis never overwrites a file', { file });
    throw new TamisError('io', `cannot write file: ${(error as Error).message}`, { file });
  } finally {
    rmSync(tmp, { force: true });
  }
}
