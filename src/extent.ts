/**
 * Smallest and largest of a list, by a loop: `Math.min(...values)` passes every value as an
 * argument and overflows the call stack beyond about 100,000 of them. Empty lists give
 * min = Infinity and max = -Infinity, as Math.min() and Math.max() do.
 */
export function extent(values: ArrayLike<number>): { min: number; max: number } {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}
