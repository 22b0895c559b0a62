/**
 * `npm run bench`: runs every benchmark suite and prints one line per figure,
 * `name: value unit`; with `--json`, one JSON object `{"name": {"value", "unit"}}`.
 * `--only <text>` runs the figures whose name contains the text.
 */
import type { Benchmark } from './benchmark.js';

/** Suites in the order they print. Each later part of tamis adds its own. */
const SUITES: readonly (() => Promise<{ benchmarks: Benchmark[] }>)[] = [
  () => import('./physics.js'),
  () => import('./detector.js'),
  () => import('./pdf.js'),
  () => import('./selection.js'),
  () => import('./generator-xsec.js'),
  () => import('./generator-events.js'),
  () => import('./stats.js'),
  () => import('./recast.js'),
];

function formatValue(value: number): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const magnitude = Math.abs(value);
  if (magnitude >= 1e4 || magnitude < 1e-3) return value.toExponential(3);
  return value.toPrecision(4);
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const json = args.includes('--json');
  const onlyIndex = args.indexOf('--only');
  const only = onlyIndex >= 0 ? args[onlyIndex + 1] : undefined;
  const figures: Record<string, { value: number; unit: string }> = {};
  for (const load of SUITES) {
    const { benchmarks } = await load();
    for (const benchmark of benchmarks) {
      if (only !== undefined && !benchmark.name.includes(only)) continue;
      const value = await benchmark.measure();
      figures[benchmark.name] = { value, unit: benchmark.unit };
      if (!json) process.stdout.write(`${benchmark.name}: ${formatValue(value)} ${benchmark.unit}\n`);
    }
  }
  if (json) process.stdout.write(`${JSON.stringify(figures, null, 2)}\n`);
}

await main();
