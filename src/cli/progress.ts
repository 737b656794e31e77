// A progress bar for long runs (maps, nights sweeps, the stages of a plan), on stderr only: drawn
// once the run has taken more than two seconds (stages: at once, since one stage may take a
// minute) and only when stderr is a terminal and the command was not given --quiet, so pipes,
// files, --json output and tests never see it.

const SHOW_AFTER_MS = 2000;
const BAR_WIDTH = 30;

export interface Progress {
  update(label: string, done: number, total: number): void;
  /** Clears the bar's line (if it was drawn). */
  end(): void;
}

export interface ProgressOptions {
  stream?: NodeJS.WriteStream;
  /** What `done` and `total` count: cells, plans, stages. */
  unit?: string;
  quiet?: boolean;
  showAfterMs?: number;
}

export function stderrProgress(options: ProgressOptions = {}): Progress {
  const { stream = process.stderr, unit = 'cells', quiet = false, showAfterMs = SHOW_AFTER_MS } = options;
  const startMs = Date.now();
  let drawn = false;
  let lastPercent = -1;
  return {
    update(label, done, total) {
      if (quiet || !stream.isTTY || Date.now() - startMs < showAfterMs) return;
      const percent = Math.floor((100 * done) / total);
      if (percent === lastPercent) return;
      lastPercent = percent;
      const filled = Math.round((BAR_WIDTH * done) / total);
      stream.write(`\r\x1b[K${label} [${'#'.repeat(filled)}${'.'.repeat(BAR_WIDTH - filled)}] ${String(percent).padStart(3)}% (${done}/${total} ${unit})`);
      drawn = true;
    },
    end() {
      if (drawn) stream.write('\r\x1b[K');
      drawn = false;
    },
  };
}
