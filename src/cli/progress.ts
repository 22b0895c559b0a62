/**
 * A progress bar with an ETA on standard error (cli-progress), shown only when
 * standard error is a terminal so logs and tests stay clean.
 */
import cliProgress from 'cli-progress';

export interface Progress {
  update(done: number, total: number): void;
  stop(): void;
}

export function progressBar(label: string): Progress {
  if (!process.stderr.isTTY) return { update: () => undefined, stop: () => undefined };
  const bar = new cliProgress.SingleBar(
    { format: `${label} [{bar}] {percentage}% | {value}/{total} | ETA {eta_formatted}`, stream: process.stderr, hideCursor: true, etaBuffer: 20 },
    cliProgress.Presets.shades_classic,
  );
  let started = false;
  return {
    update(done, total) {
      if (!started) {
        bar.start(total, 0);
        started = true;
      }
      bar.setTotal(total);
      bar.update(done);
    },
    stop() {
      if (started) bar.stop();
    },
  };
}
