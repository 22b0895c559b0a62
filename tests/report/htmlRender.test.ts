/**
 * The HTML reports render in a real browser (headless Chromium) and their plots
 * carry the expected series. The browser test is skipped, with the reason
 * printed, only when no Chromium is installed (.ci/run installs it with apt).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EXCLUSION_SERIES } from '../../src/report/plots/exclusionPlot.js';
import { ROOT, requireBuild, tamis } from '../cli/runTamis.js';

const folder = mkdtempSync(join(tmpdir(), 'tamis-html-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const chromium = ['/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'].find((p) => existsSync(p));
if (!chromium) console.log('skipping the browser rendering test: no Chromium found (install the chromium package)');

function render(page: string, png: string): { status: number | null; dom: string } {
  const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
  const profile = mkdtempSync(join(folder, 'profile-'));
  const shot = spawnSync(chromium!, [...flags, `--user-data-dir=${profile}`, '--window-size=1200,2400', `--screenshot=${png}`, `file://${page}`], { encoding: 'utf8', timeout: 90_000 });
  const dom = spawnSync(chromium!, [...flags, `--user-data-dir=${profile}`, '--dump-dom', `file://${page}`], { encoding: 'utf8', timeout: 90_000, maxBuffer: 64 * 1024 * 1024 });
  return { status: shot.status, dom: dom.stdout };
}

describe('scan report and plots', () => {
  beforeAll(() => {
    requireBuild();
    const run = tamis(folder, 'scan', join(ROOT, 'tests', 'fixtures', 'small.scan.yaml'), '--out', 'scan', '--workers', '2');
    expect(run.status, run.stderr).toBe(0);
  }, 180_000);

  it('the exclusion plot has observed and expected limits with both bands and the model cross section with its band', () => {
    const svg = readFileSync(join(folder, 'scan', 'exclusion.svg'), 'utf8');
    expect(svg.startsWith('<?xml')).toBe(true);
    for (const series of Object.values(EXCLUSION_SERIES)) expect(svg, series).toContain(series);
    for (const title of ['three-lepton-8tev (8 TeV)', 'same-sign-8tev (8 TeV)']) expect(svg).toContain(title);
    expect(svg).toContain('mass [GeV]');
    expect(svg).toContain('cross section [pb]');
  });

  it('the efficiency and cut-blame plots name the analyses and energies', () => {
    const efficiency = readFileSync(join(folder, 'scan', 'efficiency.svg'), 'utf8');
    for (const text of ['three-lepton-8tev', 'same-sign-8tev', '8 TeV', 'efficiency']) expect(efficiency).toContain(text);
    const blame = readFileSync(join(folder, 'scan', 'cut_blame.svg'), 'utf8');
    expect(blame).toContain('efficiency without the cut / with all cuts');
  });

  it('the report is self-contained: inline SVG, no external resource', () => {
    const html = readFileSync(join(folder, 'scan', 'report.html'), 'utf8');
    expect(html).toMatch(/<svg[^>]*>/);
    expect(html).not.toMatch(/<(script|link|img)[^>]+(src|href)=["']https?:/);
    expect(html).toContain('confirm the result with the experiments');
  });

  it.skipIf(!chromium)('renders in headless Chromium with its tables and plots', () => {
    const page = join(folder, 'scan', 'report.html');
    const png = join(folder, 'report.png');
    const { status, dom } = render(page, png);
    expect(status).toBe(0);
    expect(statSync(png).size).toBeGreaterThan(50_000);
    expect(dom).toContain('Mass limits');
    expect((dom.match(/<svg/g) ?? []).length).toBeGreaterThanOrEqual(3);
    writeFileSync(join(folder, 'dom.html'), dom);
  }, 180_000);
});
