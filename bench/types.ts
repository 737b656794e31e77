/** One benchmark: `run` returns its figures; the runner prints them as one JSON line with `bench: name`. */
export interface BenchModule {
  name: string;
  run(): Promise<Record<string, unknown>> | Record<string, unknown>;
}

/** Wall-clock seconds of a call (benches only; the core never reads the clock). */
export function timeSec<T>(fn: () => T): { value: T; sec: number } {
  const t0 = process.hrtime.bigint();
  const value = fn();
  return { value, sec: Number(process.hrtime.bigint() - t0) / 1e9 };
}
