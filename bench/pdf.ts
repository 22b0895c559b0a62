/**
 * Figures of the parton densities: time to build the built-in grid (first build in
 * the process, as a CLI run pays it, and later builds once compiled), and the time
 * per lookup of one flavour (`xfx`) and of all flavours (`xfxAll`, the generator's
 * hot path) at x log-uniform in [1e-5, 0.9] and Q log-uniform in [10, 5000] GeV.
 * The `_cpu` figures count CPU time of this process instead of wall time, which a
 * busy machine inflates less.
 */
import { buildLesHouchesGrid } from '../src/physics/pdf/lesHouchesGrid.js';
import { RandomStream } from '../src/physics/random.js';
import { ratePerSecond, secondsFor, type Benchmark } from './benchmark.js';

const POINTS = 4096;
const rng = RandomStream.forStream(31, 5);
const xs = Float64Array.from({ length: POINTS }, () => 1e-5 * (0.9 / 1e-5) ** rng.uniform());
const qs = Float64Array.from({ length: POINTS }, () => 10 * 500 ** rng.uniform());
const flavours = Int32Array.from({ length: POINTS }, (_, i) => [21, 1, 2, 3, 4, 5, -1, -2, -3, -4, -5][i % 11]!);
let grid: ReturnType<typeof buildLesHouchesGrid> | undefined;
let sink = 0;

/** CPU nanoseconds per item of `fn(batch)`, repeated for at least `minSeconds` of CPU time after a warm-up. */
function cpuNanosecondsPerItem(fn: (batch: number) => void, batch: number, minSeconds = 0.5): number {
  fn(batch);
  const start = process.cpuUsage();
  let items = 0;
  let used = 0;
  while (used < minSeconds * 1e6) {
    fn(batch);
    items += batch;
    const { user, system } = process.cpuUsage(start);
    used = user + system;
  }
  return (used * 1e3) / items;
}

/** `batch` lookups of one flavour at the benchmark points. */
function lookups(batch: number): void {
  const pdf = densities();
  let s = 0;
  for (let i = 0; i < batch; i++) s += pdf.xfx(flavours[i & (POINTS - 1)]!, xs[i & (POINTS - 1)]!, qs[i & (POINTS - 1)]!);
  sink += s;
}

const allFlavours = new Float64Array(13);
/** `batch` all-flavour lookups at the benchmark points. */
function allFlavourLookups(batch: number): void {
  const pdf = densities();
  let s = 0;
  for (let i = 0; i < batch; i++) {
    pdf.xfxAll(xs[i & (POINTS - 1)]!, qs[i & (POINTS - 1)]!, allFlavours);
    s += allFlavours[8]!;
  }
  sink += s;
}

/** The grid, built on first use (the first build is the one timed by pdf_grid_build_time). */
function densities(): ReturnType<typeof buildLesHouchesGrid> {
  grid ??= buildLesHouchesGrid();
  return grid;
}

export const benchmarks: Benchmark[] = [
  {
    name: 'pdf_grid_build_time',
    unit: 's',
    measure: () => secondsFor(() => densities()),
  },
  {
    name: 'pdf_grid_build_time_compiled',
    unit: 's',
    measure: () => {
      densities();
      let total = 0;
      for (let k = 0; k < 3; k++) total += secondsFor(() => buildLesHouchesGrid());
      return total / 3;
    },
  },
  { name: 'pdf_lookup_time', unit: 'ns', measure: () => 1e9 / ratePerSecond(lookups, 200_000) },
  { name: 'pdf_lookup_cpu_time', unit: 'ns', measure: () => cpuNanosecondsPerItem(lookups, 200_000) },
  { name: 'pdf_xfx_all_time', unit: 'ns', measure: () => 1e9 / ratePerSecond(allFlavourLookups, 50_000) },
  { name: 'pdf_xfx_all_cpu_time', unit: 'ns', measure: () => cpuNanosecondsPerItem(allFlavourLookups, 50_000) },
];

export function keepAlive(): number {
  return sink;
}
