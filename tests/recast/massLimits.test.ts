import { describe, expect, it } from 'vitest';
import { formatRanges, massLimit } from '../../src/recast/scan/massLimits.js';
import { expectClose } from '../helpers.js';

describe('mass limits from r along a scan', () => {
  it('interpolates log r linearly: r = 2 at 200 and 0.5 at 300 cross 1 at 250', () => {
    const l = massLimit([100, 200, 300], [4, 2, 0.5]);
    expectClose(l.limit, 250, { rel: 1e-12 });
    expect(l.status).toBe('inside');
    expect(l.ranges).toHaveLength(1);
    expect(l.ranges[0]!.openBelow).toBe(true);
  });
  it('an exponentially falling r gives the exact crossing (r = e^{-(m - 230)/50})', () => {
    const masses = [150, 200, 250, 300];
    const r = masses.map((m) => Math.exp(-(m - 230) / 50));
    expectClose(massLimit(masses, r).limit, 230, { rel: 1e-12 });
  });
  it('reports nothing excluded, and exclusion up to the last point', () => {
    expect(massLimit([100, 200], [0.5, 0.2]).status).toBe('none');
    expect(Number.isNaN(massLimit([100, 200], [0.5, 0.2]).limit)).toBe(true);
    const all = massLimit([100, 200], [3, 2]);
    expect(all.status).toBe('beyond');
    expect(all.limit).toBe(200);
  });
  it('finds islands and handles zero r (no sensitivity) with linear interpolation', () => {
    const l = massLimit([100, 200, 300, 400, 500], [0, 2, 0.5, 1.5, 0]);
    expect(l.ranges).toHaveLength(2);
    expectClose(l.ranges[0]!.from, 150, { rel: 1e-12 });
    expectClose(l.ranges[1]!.to, 400 + 100 * (0.5 / 1.5), { rel: 1e-12 });
    // 300 -> 400: log r from ln 0.5 to ln 1.5 crosses 0 at 300 + 100 ln2 / ln3 = 363.1
    expect(formatRanges(l.ranges)).toBe('150-250; 363.1-433.3');
  });
  it('sorts unordered masses first', () => {
    expectClose(massLimit([300, 100, 200], [0.5, 4, 2]).limit, 250, { rel: 1e-12 });
  });
});
