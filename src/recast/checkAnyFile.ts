/**
 * `tamis check` for every file kind: scan files (*.scan.yaml) are read by the
 * scan loader, which also checks the model of every point; analysis, detector
 * and model files go to the selection's checker.
 */
import { basename } from 'node:path';
import { checkFile, type CheckOutcome } from '../selection/checkFile.js';
import { loadScan } from './scan/loadScan.js';

export interface AnyCheckOutcome {
  file: string;
  kind: CheckOutcome['kind'] | 'scan';
  summary: string;
}

export async function checkAnyFile(file: string): Promise<AnyCheckOutcome> {
  if (/\.scan\.ya?ml$/.test(basename(file))) {
    const scan = loadScan(file);
    const axes = scan.axes.map((a) => `${a.name} ${a.values[0]}-${a.values[a.values.length - 1]} ${a.unit} (${a.values.length})`).join(' x ');
    return { file, kind: 'scan', summary: `${scan.name}, ${scan.points.length} points (${axes}), ${scan.energies.join(' and ')} TeV, ${scan.analyses.length} analyses` };
  }
  return checkFile(file);
}
