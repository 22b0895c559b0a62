/** The README and every report carry the same cautions and list of simplifications. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CAUTIONS, SIMPLIFICATIONS } from '../../src/report/cautions.js';
import { htmlPage } from '../../src/report/htmlPage.js';

const README = readFileSync(join(import.meta.dirname, '..', '..', 'README.md'), 'utf8');

describe('cautions and simplifications', () => {
  it('the README lists every physics simplification the reports list', () => {
    for (const s of SIMPLIFICATIONS) expect(README, s).toContain(`- ${s.replace(/\u2019/g, "'")}`);
  });
  it('the README tells users to confirm exclusions with the experiments\u2019 own tools', () => {
    expect(README).toMatch(/approximate reinterpretations/);
    expect(README).toMatch(/confirm the result with\s+> the experiments' own tools and a full simulation/);
  });
  it('an HTML page shows the cautions before any section', () => {
    const html = htmlPage({ title: 't', lead: 'l', cautions: CAUTIONS, sections: [{ id: 'a', title: 'A', html: '<p>x</p>' }], provenance: [] });
    expect(html.indexOf('class="caution"')).toBeLessThan(html.indexOf('<section'));
    for (const c of CAUTIONS) expect(html).toContain(c);
  });
});
