// Ticks of a log axis, every one labelled: round values (1, 2, 3, 5 per decade, or fewer) inside the domain.

/** Mantissas per decade, densest first. */
const MANTISSAS: readonly number[][] = [[1, 2, 3, 5], [1, 2, 5], [1, 3], [1]];

/** The smallest gap between neighbouring ticks of a mantissa set, in decades (the next decade's 1 included). */
const minGapDecades = (set: number[]) => Math.min(...set.map((m, i) => Math.log10((set[i + 1] ?? 10) / m)));

/**
 * The densest round values inside [lo, hi] whose neighbours stand at least `minGapPx` apart on an
 * axis `lengthPx` long, so that no label has to be skipped; when fewer than two such values fall
 * inside, the domain's ends.
 */
export function logTicks(lo: number, hi: number, lengthPx: number, minGapPx: number): number[] {
  const pxPerDecade = lengthPx / Math.log10(hi / lo);
  const set = MANTISSAS.find((s) => minGapDecades(s) * pxPerDecade >= minGapPx) ?? [1];
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of set) {
      const v = Number((m * 10 ** e).toPrecision(12));
      if (v >= lo && v <= hi) ticks.push(v);
    }
  }
  return ticks.length >= 2 ? ticks : [lo, hi];
}
