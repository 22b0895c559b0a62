/**
 * End-to-end runs of `tamis cutflow` on Les Houches files written for the
 * test: WZ-like events (Z -> mu mu on the Z mass, W -> e nu) and events with
 * only quarks, at 8 TeV.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EventRecord, STATUS_DECAYED, STATUS_FINAL, STATUS_INCOMING } from '../../src/generator/eventRecord.js';
import { LheWriter } from '../../src/generator/lhe/lheWriter.js';
import { M_W, M_Z } from '../../src/physics/constants.js';
import { setPtEtaPhiM } from '../../src/physics/fourVector.js';
import { RandomStream } from '../../src/physics/random.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const folder = mkdtempSync(join(tmpdir(), 'tamis-cli-cutflow-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const sample = join(folder, 'wz.lhe');
const EVENTS = 400;

function add(record: EventRecord, id: number, status: number, mother: number, pt: number, eta: number, phi: number, mass = 0): number {
  const p = new Float64Array(4);
  setPtEtaPhiM(p, 0, pt, eta, phi, mass);
  return record.add(id, status, mother, mother, p[0]!, p[1]!, p[2]!, p[3]!, mass);
}

beforeAll(() => {
  const rng = RandomStream.forStream(99, 1);
  const writer = new LheWriter(sample, { beamIds: [2212, 2212], beamEnergies: [4000, 4000], pdfGroups: [-1, -1], pdfSets: [-1, -1], weighting: 3, processes: [{ processId: 1, crossSectionPb: 0.5, errorPb: 0.01, maxWeight: 0.5 }] }, { model: 'test sample' });
  const record = new EventRecord();
  for (let k = 0; k < EVENTS; k++) {
    record.clear();
    record.add(2, STATUS_INCOMING, -1, -1, 0, 0, 300, 300, 0);
    record.add(-1, STATUS_INCOMING, -1, -1, 0, 0, -300, 300, 0);
    record.weight = 0.5 / EVENTS;
    record.processId = 1;
    if (k % 4 === 3) {
      // Quarks only: no lepton, so no three-lepton event.
      for (let q = 0; q < 3; q++) add(record, q === 0 ? 5 : 1, STATUS_FINAL, 0, 60 + 20 * q, rng.uniformIn(-2, 2), rng.uniformIn(-3, 3));
    } else {
      // Z -> mu+ mu- back to back with pair mass M_Z (massless: m^2 = 2 pT^2 (cosh(d eta) + 1)); W -> e+ nu.
      const eta1 = rng.uniformIn(-1, 1);
      const eta2 = rng.uniformIn(-1, 1);
      const phi = rng.uniformIn(-3, 3);
      const pt = M_Z / Math.sqrt(2 * (Math.cosh(eta1 - eta2) + 1));
      const z = add(record, 23, STATUS_DECAYED, 0, 0, 0, 0, M_Z);
      add(record, 13, STATUS_FINAL, z, pt, eta1, phi);
      add(record, -13, STATUS_FINAL, z, pt, eta2, phi + Math.PI);
      const w = add(record, 24, STATUS_DECAYED, 0, 0, 0, 0, M_W);
      add(record, -11, STATUS_FINAL, w, rng.uniformIn(30, 60), rng.uniformIn(-1.5, 1.5), phi + 1.5);
      add(record, 12, STATUS_FINAL, w, rng.uniformIn(60, 120), rng.uniformIn(-1.5, 1.5), phi - 1.5);
    }
    writer.writeEvent(record);
  }
  writer.close();
});

function tamis(...args: string[]): { status: number; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/tamis.js'), ...args], { cwd: folder, encoding: 'utf8' });
  return { status: run.status ?? -1, stdout: run.stdout, stderr: run.stderr };
}

const THREE_LEPTON_8 = join(ROOT, 'analyses/three-lepton-8tev.yaml');

describe('tamis cutflow', () => {
  it('prints the cut-flow and region table of every analysis at the file energy and skips the others', () => {
    const run = tamis('cutflow', '--analyses', join(ROOT, 'analyses'), '--events', sample);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain(`${sample}: ${EVENTS} events at 8 TeV, detector seed 1`);
    expect(run.stdout).toContain('skipped (other collider energy): same-sign-13tev, three-lepton-13tev');
    expect(run.stdout).toMatch(/^three-lepton-8tev \(8 TeV, 20\.3 fb\^-1\): 400 events$/m);
    expect(run.stdout).toMatch(/^same-sign-8tev \(8 TeV, 20\.3 fb\^-1\): 400 events$/m);
    expect(run.stdout).toMatch(/^step +events +efficiency +mc error +of previous$/m);
    expect(run.stdout).toMatch(/^region overlaps: none$/m);
  });

  it('gives JSON whose numbers hang together: monotone cut-flow, three quarters of the events at most, on-Z bins filled', () => {
    const run = tamis('cutflow', '--analyses', THREE_LEPTON_8, '--events', sample, '--json', '--seed', '5');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout) as { events: number; energyTev: number; seed: number; analyses: { steps: { events: number; efficiency: number }[]; regions: { name: string; events: number; blame: unknown[] }[]; total: { events: number } }[] };
    expect([json.events, json.energyTev, json.seed]).toEqual([EVENTS, 8, 5]);
    const a = json.analyses[0]!;
    expect(a.total.events).toBe(EVENTS);
    const counts = a.steps.map((s) => s.events);
    for (let i = 1; i < counts.length; i++) expect(counts[i]!).toBeLessThanOrEqual(counts[i - 1]!);
    // A quarter of the events has no lepton at all.
    expect(counts[0]!).toBeLessThanOrEqual((3 * EVENTS) / 4);
    expect(counts[0]!).toBeGreaterThan(EVENTS / 4);
    const onZ = a.regions.filter((r) => r.name.startsWith('l3-b0-onz')).reduce((s, r) => s + r.events, 0);
    const offZ = a.regions.filter((r) => r.name.startsWith('l3-b0-offz')).reduce((s, r) => s + r.events, 0);
    expect(onZ).toBeGreaterThan(5 * offZ);
    expect(a.regions[0]!.blame).toHaveLength(4 + 5);
  });

  it('gives the same bytes for the same seed', () => {
    const first = tamis('cutflow', '--analyses', THREE_LEPTON_8, '--events', sample, '--json', '--seed', '11');
    const second = tamis('cutflow', '--analyses', THREE_LEPTON_8, '--events', sample, '--json', '--seed', '11');
    expect(first.status).toBe(0);
    expect(second.stdout).toBe(first.stdout);
  });

  it('refuses analyses of another energy, a malformed file and bad options with one located line', () => {
    const energy = tamis('cutflow', '--analyses', join(ROOT, 'analyses/three-lepton-13tev.yaml'), '--events', sample);
    expect(energy.status).toBe(2);
    expect(energy.stderr).toBe(`tamis: ${sample}: the events are at 8 TeV but the analyses are at 13 TeV (hint: give analyses of the same collider energy as the event file)\n`);
    const broken = join(folder, 'broken.lhe');
    writeFileSync(broken, '<LesHouchesEvents version="3.0">\n<init>\n2212 2212 4000 4000\n');
    const malformed = tamis('cutflow', '--analyses', THREE_LEPTON_8, '--events', broken);
    expect(malformed.status).toBe(1);
    expect(malformed.stderr).toMatch(new RegExp(`^tamis: ${broken}:\\d+`));
    const seed = tamis('cutflow', '--analyses', THREE_LEPTON_8, '--events', sample, '--seed', '-3');
    expect(seed.status).toBe(2);
    expect(seed.stderr).toBe('tamis: --seed: must be >= 0, got -3\n');
  });
});
