/**
 * The mass reach of a scan: where r = sigma_model / sigma95 crosses 1 along
 * the mass axis. Between two scan points log r is interpolated linearly in the
 * mass (cross sections fall roughly exponentially with mass, common practice);
 * a zero r (no sensitivity) is interpolated linearly instead.
 */

export interface ExcludedRange {
  from: number;
  to: number;
  /** The range reaches the first (or last) scan point: the true edge may lie beyond. */
  openBelow: boolean;
  openAbove: boolean;
}

export interface MassLimit {
  /** Upper end of the highest excluded range (NaN when nothing is excluded). */
  limit: number;
  /** 'none' (nothing excluded), 'inside' (the limit lies inside the scan), 'beyond' (excluded up to the last point). */
  status: 'none' | 'inside' | 'beyond';
  ranges: ExcludedRange[];
}

function crossing(m1: number, r1: number, m2: number, r2: number): number {
  if (r1 > 0 && r2 > 0) {
    const l1 = Math.log(r1);
    const l2 = Math.log(r2);
    return l1 === l2 ? m1 : m1 + ((m2 - m1) * l1) / (l1 - l2);
  }
  return r1 === r2 ? m1 : m1 + ((m2 - m1) * (1 - r1)) / (r2 - r1);
}

/**
 * Excluded ranges and the mass limit from r at increasing masses.
 *
 * @example
 * massLimit([100, 200, 300], [4, 2, 0.5]).limit // 250 (log r halfway from 2 to 0.5 crosses 0 at 250)
 */
export function massLimit(masses: readonly number[], r: readonly number[]): MassLimit {
  const order = masses.map((m, i) => i).sort((a, b) => masses[a]! - masses[b]!);
  const m = order.map((i) => masses[i]!);
  const v = order.map((i) => (Number.isFinite(r[i]!) ? r[i]! : r[i]! > 0 ? Infinity : 0));
  const ranges: ExcludedRange[] = [];
  let start: number | undefined;
  let openBelow = false;
  for (let i = 0; i < m.length; i++) {
    const excluded = v[i]! >= 1;
    if (excluded && start === undefined) {
      openBelow = i === 0;
      start = i === 0 ? m[0]! : crossing(m[i - 1]!, v[i - 1]!, m[i]!, Math.min(v[i]!, 1e300));
    }
    if (!excluded && start !== undefined) {
      ranges.push({ from: start, to: crossing(m[i - 1]!, Math.min(v[i - 1]!, 1e300), m[i]!, v[i]!), openBelow, openAbove: false });
      start = undefined;
    }
  }
  if (start !== undefined) ranges.push({ from: start, to: m[m.length - 1]!, openBelow, openAbove: true });
  const last = ranges[ranges.length - 1];
  if (last === undefined) return { limit: Number.NaN, status: 'none', ranges };
  return { limit: last.to, status: last.openAbove ? 'beyond' : 'inside', ranges };
}

/** Ranges as text for tables: "150–310" with "<"/">" where a range is open. */
export function formatRanges(ranges: readonly ExcludedRange[], digits = 4): string {
  if (ranges.length === 0) return 'none';
  const f = (x: number) => String(Number(x.toPrecision(digits)));
  return ranges.map((r) => `${r.openBelow ? '<=' : ''}${f(r.from)}-${f(r.to)}${r.openAbove ? '+' : ''}`).join('; ');
}
