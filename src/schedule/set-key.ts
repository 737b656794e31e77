// A key of a set of slots that follows adds and removals in O(1): the XOR of a pseudo-random
// 32-bit code per slot, two codes per slot for a 64-bit key (Zobrist hashing, Zobrist 1970,
// common practice). The codes come from the integer hash "lowbias32" (C. Wellons's hash
// prospector, common practice), of 2j and 2j + 1.

/** lowbias32 of x, a 32-bit integer. */
function lowbias32(x: number): number {
  let h = x | 0;
  h = Math.imul(h ^ (h >>> 16), 0x7feb352d);
  h = Math.imul(h ^ (h >>> 15), 0x846ca68b);
  return h ^ (h >>> 16);
}

/** The two codes of slot j: XOR them into a set's key halves to add or remove j. */
export function slotCodeLow(j: number): number {
  return lowbias32(2 * j);
}

export function slotCodeHigh(j: number): number {
  return lowbias32(2 * j + 1);
}
