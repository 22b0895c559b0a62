/**
 * End-to-end runs of the compiled CLI (`npm test` builds dist/ first):
 * tamis check, new-analysis and variables.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = new URL('../../', import.meta.url).pathname;
const folder = mkdtempSync(join(tmpdir(), 'tamis-cli-check-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function tamis(...args: string[]): { status: number; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [join(ROOT, 'bin/tamis.js'), ...args], { cwd: folder, encoding: 'utf8' });
  return { status: run.status ?? -1, stdout: run.stdout, stderr: run.stderr };
}

const analyses = readdirSync(join(ROOT, 'analyses')).filter((f) => f.endsWith('.yaml')).map((f) => join(ROOT, 'analyses', f));
const detectors = readdirSync(join(ROOT, 'analyses/detectors')).map((f) => join(ROOT, 'analyses/detectors', f));
const models = existsSync(join(ROOT, 'data-demo')) ? readdirSync(join(ROOT, 'data-demo')).filter((f) => f.endsWith('.model.yaml')).map((f) => join(ROOT, 'data-demo', f)) : [];

describe('tamis check', () => {
  it('accepts every shipped analysis, detector profile and demo model, one ok line each, exit 0', () => {
    const files = [...analyses, ...detectors, ...models];
    const run = tamis('check', ...files);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const lines = run.stdout.trim().split('\n');
    expect(lines).toHaveLength(files.length);
    expect(lines.filter((l) => /^ok .* \(analysis: /.test(l))).toHaveLength(analyses.length);
    expect(lines.filter((l) => /^ok .* \(detector profile: /.test(l))).toHaveLength(detectors.length);
    expect(lines.filter((l) => /^ok .* \(model: /.test(l))).toHaveLength(models.length);
    expect(run.stdout).toContain('(analysis: three-lepton-8tev, 8 TeV, 20.3 fb^-1, 4 steps, 36 regions, detector generic-8tev.yaml, invented numbers)');
  });

  it('prints the located error of a broken file, still checks the others, and exits 1', () => {
    const text = readFileSync(join(ROOT, 'analyses/same-sign-8tev.yaml'), 'utf8').replace('cut: n_ss_pairs == 1', 'cut: n_ss_pair == 1').replace('detector: detectors/', 'detector: ../analyses/detectors/');
    const broken = join(folder, 'broken.yaml');
    writeFileSync(broken, text);
    const line = text.split('\n').findIndex((l) => l.includes('n_ss_pair == 1')) + 1;
    const run = tamis('check', broken, analyses[0]!);
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/^ok .*same-sign-13tev\.yaml/);
    expect(run.stderr).toContain(`tamis: ${broken}:${line}:10: steps[1].cut: unknown variable "n_ss_pair" at column 1 (hint: did you mean "n_ss_pairs"?`);
    expect(run.stderr).toContain('1 of 2 files failed the check');
  });

  it('names a missing file', () => {
    const run = tamis('check', 'nowhere.yaml');
    expect(run.status).toBe(1);
    expect(run.stderr).toContain('tamis: nowhere.yaml: file not found');
  });
});

describe('tamis new-analysis', () => {
  it('writes a commented starting file that passes tamis check, and never overwrites it', () => {
    const made = tamis('new-analysis', 'my-search', '--energy', '8');
    expect(made.status).toBe(0);
    const file = join(folder, 'my-search.yaml');
    const text = readFileSync(file, 'utf8');
    expect(text).toMatch(/^# my-search: a tamis analysis definition/);
    expect(tamis('check', 'my-search.yaml').stdout).toMatch(/^ok my-search\.yaml \(analysis: my-search, 8 TeV, 20\.3 fb\^-1/);
    const again = tamis('new-analysis', 'my-search');
    expect(again.status).toBe(2);
    expect(again.stderr).toContain('file exists already');
    expect(readFileSync(file, 'utf8')).toBe(text);
    expect(readdirSync(folder).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('refuses an id the format does not allow, writing nothing', () => {
    const run = tamis('new-analysis', 'My Search', '--out', 'x.yaml');
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/analysis id "My Search" must use lower-case letters/);
    expect(existsSync(join(folder, 'x.yaml'))).toBe(false);
  });
});

describe('tamis variables', () => {
  it('prints the Markdown table that analyses/README.md carries', () => {
    const run = tamis('variables', '--markdown');
    expect(run.status).toBe(0);
    expect(readFileSync(join(ROOT, 'analyses/README.md'), 'utf8')).toContain(run.stdout.trim());
  });
});
