// A progress bar for long runs (maps, nights sweeps), on stderr only: drawn once the run has taken more than two
// seconds and only when stderr is a terminal, so pipes, files and tests never see it.

const SHOW_AFTER_MS = 2000;
const BAR_WIDTH = 30;

export interface Progress {
  update(label: string, done: number, total: number): void;
  /** Clears the bar's line (if it was drawn). */
  end(): void;
}

export function stderrProgress(stream: NodeJS.WriteStream = process.stderr, unit = 'cells'): Progress {
  const startMs = Date.now();
  let drawn = false;
  let lastPercent = -1;
  return {
    update(label, done, total) {
      if (!stream.isTTY || Date.now() - startMs < SHOW_AFTER_MS) return;
      const percent = Math.floor((100 * done) / total);
      if (percent === lastPercent) return;
      lastPercent = percent;
      const filled = Math.round((BAR_WIDTH * done) / total);
      stream.write(`\r${label} [${'#'.repeat(filled)}${'.'.repeat(BAR_WIDTH - filled)}] ${String(percent).padStart(3)}% (${done}/${total} ${unit})`);
      drawn = true;
    },
    end() {
      if (drawn) stream.write('\r\x1b[K');
      drawn = false;
    },
  };
}
