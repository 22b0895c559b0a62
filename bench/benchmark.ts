/**
 * The benchmark contract: every suite under bench/ exports `benchmarks`, a
 * list of figures. Figures are printed, never asserted: speed goals live in
 * the issue notes, not in tests.
 */
export interface Benchmark {
  /** Figure name, printed as `name: value unit` (snake_case, says what is measured). */
  name: string;
  unit: string;
  /** Runs the measurement and returns the figure. */
  measure(): number | Promise<number>;
}

/** Seconds elapsed while running `fn` once. */
export function secondsFor(fn: () => void): number {
  const start = process.hrtime.bigint();
  fn();
  return Number(process.hrtime.bigint() - start) / 1e9;
}

/**
 * Repeats `fn(batch)` until at least `minSeconds` have passed (after one warm-up
 * call) and returns the rate in items per second, where `fn` processes `batch` items.
 */
export function ratePerSecond(fn: (batch: number) => void, batch: number, minSeconds = 0.5): number {
  fn(batch); // warm-up: let the JIT compile the hot path
  let items = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0;
  while (elapsed < minSeconds) {
    fn(batch);
    items += batch;
    elapsed = Number(process.hrtime.bigint() - start) / 1e9;
  }
  return items / elapsed;
}
