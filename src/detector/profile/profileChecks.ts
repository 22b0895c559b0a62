/**
 * Checks of a detector profile that its zod schema cannot express: bin edges
 * that increase, tables whose shape matches their edges, resolution terms with
 * one value per bin, and tables that stay inside the detector's acceptance.
 * Each failure is a `TamisError` located at the offending key.
 */
import { TamisError } from '../../errors.js';
import type { KeyPath, YamlSource } from '../../io/yamlFile.js';
import type { DetectorProfileFile, EfficiencyTableFile, EtaValuesFile, ResolutionFile } from './schema.js';

type Locate = YamlSource<unknown>['locate'];

/** Throws the first problem found in `profile`, located through `locate`. */
export function checkDetectorProfile(profile: DetectorProfileFile, locate: Locate): void {
  const fail = (path: KeyPath, message: string, suggestion?: string): never => {
    throw new TamisError('schema', message, { ...locate(path), suggestion });
  };
  const tracker = profile.acceptance.tracker_abs_eta;
  const calorimeter = profile.acceptance.calorimeter_abs_eta;
  if (tracker > calorimeter) {
    fail(['acceptance', 'tracker_abs_eta'], `tracker coverage ${tracker} exceeds the calorimeter coverage ${calorimeter}`, 'the calorimeters cover at least the tracker acceptance');
  }
  if (profile.jets.abs_eta_max > calorimeter) {
    fail(['jets', 'abs_eta_max'], `jets up to |eta| ${profile.jets.abs_eta_max} lie beyond the calorimeter coverage ${calorimeter} (acceptance.calorimeter_abs_eta)`);
  }
  const trackerTables: [KeyPath, EfficiencyTableFile][] = [
    [['electrons', 'efficiency'], profile.electrons.efficiency],
    [['muons', 'efficiency'], profile.muons.efficiency],
    [['taus', 'efficiency'], profile.taus.efficiency],
    [['taus', 'jet_fake_rate'], profile.taus.jet_fake_rate],
    [['b_tagging', 'b_efficiency'], profile.b_tagging.b_efficiency],
    [['b_tagging', 'c_mistag'], profile.b_tagging.c_mistag],
    [['b_tagging', 'light_mistag'], profile.b_tagging.light_mistag],
    [['b_tagging', 'tau_mistag'], profile.b_tagging.tau_mistag],
  ];
  for (const [path, table] of trackerTables) {
    checkEfficiencyTable(table, path, fail);
    const last = table.abs_eta_edges.length - 1;
    if (table.abs_eta_edges[last]! > tracker) {
      fail([...path, 'abs_eta_edges', last], `|eta| edge ${table.abs_eta_edges[last]} lies beyond the tracker coverage ${tracker} (acceptance.tracker_abs_eta): this measurement needs tracks`);
    }
  }
  for (const kind of ['electrons', 'muons', 'taus'] as const) {
    checkEtaValues(profile[kind].charge_flip, [kind, 'charge_flip'], fail);
    checkResolution(profile[kind].resolution, [kind, 'resolution'], fail);
  }
  checkResolution(profile.jets.resolution, ['jets', 'resolution'], fail);
}

type Fail = (path: KeyPath, message: string, suggestion?: string) => never;

function checkIncreasing(edges: readonly number[], path: KeyPath, fail: Fail): void {
  for (let k = 1; k < edges.length; k++) {
    if (!(edges[k]! > edges[k - 1]!)) {
      fail([...path, k], `bin edges must increase strictly, but ${edges[k]} follows ${edges[k - 1]}`);
    }
  }
}

function checkStartsAtZero(edges: readonly number[], path: KeyPath, fail: Fail): void {
  if (edges[0] !== 0) fail([...path, 0], `the first |eta| edge must be 0, got ${edges[0]}`, 'every object needs a value, so the bins start at |eta| = 0');
}

function checkEfficiencyTable(table: EfficiencyTableFile, path: KeyPath, fail: Fail): void {
  checkIncreasing(table.pt_edges, [...path, 'pt_edges'], fail);
  checkIncreasing(table.abs_eta_edges, [...path, 'abs_eta_edges'], fail);
  const rows = table.pt_edges.length - 1;
  const columns = table.abs_eta_edges.length - 1;
  const shape = `expected ${rows} row${rows === 1 ? '' : 's'} x ${columns} column${columns === 1 ? '' : 's'} (one row per pt bin of pt_edges, one column per |eta| bin of abs_eta_edges)`;
  if (table.values.length !== rows) fail([...path, 'values'], `${shape}, got ${table.values.length} row${table.values.length === 1 ? '' : 's'}`);
  table.values.forEach((row, i) => {
    if (row.length !== columns) fail([...path, 'values', i], `${shape}, got ${row.length} value${row.length === 1 ? '' : 's'} in row ${i + 1}`);
  });
}

function checkEtaValues(table: EtaValuesFile, path: KeyPath, fail: Fail): void {
  checkIncreasing(table.abs_eta_edges, [...path, 'abs_eta_edges'], fail);
  checkStartsAtZero(table.abs_eta_edges, [...path, 'abs_eta_edges'], fail);
  const bins = table.abs_eta_edges.length - 1;
  if (table.values.length !== bins) {
    fail([...path, 'values'], `expected ${bins} value${bins === 1 ? '' : 's'} (one per |eta| bin of abs_eta_edges), got ${table.values.length}`);
  }
}

function checkResolution(resolution: ResolutionFile, path: KeyPath, fail: Fail): void {
  checkIncreasing(resolution.abs_eta_edges, [...path, 'abs_eta_edges'], fail);
  checkStartsAtZero(resolution.abs_eta_edges, [...path, 'abs_eta_edges'], fail);
  const bins = resolution.abs_eta_edges.length - 1;
  for (const term of ['noise', 'stochastic', 'constant', 'linear'] as const) {
    const values = resolution[term];
    if (values !== undefined && values.length !== bins) {
      fail([...path, term], `expected ${bins} value${bins === 1 ? '' : 's'} (one per |eta| bin of abs_eta_edges), got ${values.length}`);
    }
  }
}
