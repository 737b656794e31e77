// Marcum's Q function of order 1, Q1(a, b) = P(R > b) for R Rice-distributed with parameter a
// and unit scale; equivalently P(chi'^2_2(lambda = a^2) > b^2), the tail of the noncentral
// chi-square with 2 degrees of freedom [Marcum1960] [Rice1944]. By the Poisson mixture of central
// chi-squares [Johnson1995, ch. 29]:
//   Q1(a, b) = sum_j Pois(j; a^2/2) S_j,  S_j = P(chi^2_(2+2j) > b^2) = e^(-b^2/2) sum_(i<=j) (b^2/2)^i / i!.
// The table (marcumQ1Table) samples it on a square grid for bilinear look-up in the scheduler's hot loop.

/** Q1(a, b) by the Poisson series (absolute error below 1e-13), a, b >= 0. */
export function marcumQ1(a: number, b: number): number {
  const halfLambda = (a * a) / 2;
  const halfX = (b * b) / 2;
  // Terms of the Poisson weights and of the chi-square survival, both built by recurrence from j = 0.
  let pois = Math.exp(-halfLambda);
  let term = Math.exp(-halfX);
  let survival = term;
  let mass = 0;
  let sum = 0;
  const last = Math.ceil(Math.max(halfLambda, halfX) + 12 * Math.sqrt(Math.max(halfLambda, halfX)) + 40);
  for (let j = 0; j <= last; j++) {
    sum += pois * survival;
    mass += pois;
    pois *= halfLambda / (j + 1);
    term *= halfX / (j + 1);
    survival = Math.min(1, survival + term);
    // Past b^2/2's bulk S_j is 1: the rest of the Poisson mass counts whole.
    if (j > halfX && 1 - survival < 1e-16) return Math.min(1, sum + Math.max(0, 1 - mass));
  }
  return Math.min(1, sum);
}

/**
 * Step and extent of the table in a and b: Q1 is 1 to 1e-14 beyond a = b + 9; b stops at 14
 * (z* = 196): a larger threshold (only with the fewest visits) counts as no detection.
 */
export const MARCUM_TABLE_STEP = 0.05;
const A_MAX = 24;
const B_MAX = 14;
const A_COUNT = Math.round(A_MAX / MARCUM_TABLE_STEP) + 1;
const B_COUNT = Math.round(B_MAX / MARCUM_TABLE_STEP) + 1;

let table: Float64Array | undefined;

/** Q1 on the grid a = i h, b = k h (h = MARCUM_TABLE_STEP), row-major in b; built on first use. */
export function marcumQ1Table(): Float64Array {
  if (table) return table;
  table = new Float64Array(A_COUNT * B_COUNT);
  for (let k = 0; k < B_COUNT; k++) {
    const b = k * MARCUM_TABLE_STEP;
    for (let i = 0; i < A_COUNT; i++) {
      const a = i * MARCUM_TABLE_STEP;
      // Far from the diagonal the tail is 0 or 1 to double precision.
      table[k * A_COUNT + i] = a > b + 9 ? 1 : b > a + 9 ? 0 : marcumQ1(a, b);
    }
  }
  return table;
}

/** The table's row position of b: the row below and the fraction towards the next (b past the table: row -1). */
export function marcumRow(b: number): { row: number; fraction: number } {
  const y = b / MARCUM_TABLE_STEP;
  if (y >= B_COUNT - 1) return { row: -1, fraction: 0 };
  const k = Math.floor(y);
  return { row: k * A_COUNT, fraction: y - k };
}

/** marcumQ1Lookup with b's row found once (marcumRow): the hot loop's form. */
export function marcumQ1InRow(q: Float64Array, a: number, row: number, fy: number): number {
  if (row < 0) return 0;
  const x = a / MARCUM_TABLE_STEP;
  if (x >= A_COUNT - 1) return 1;
  const i = Math.floor(x);
  const fx = x - i;
  const at = row + i;
  const lo = q[at]! + fx * (q[at + 1]! - q[at]!);
  const hi = q[at + A_COUNT]! + fx * (q[at + A_COUNT + 1]! - q[at + A_COUNT]!);
  return lo + fy * (hi - lo);
}

/** Q1(a, b) by bilinear interpolation in the table (error below 3e-4 at step 0.05); a past the table counts as 1, b past it as 0. */
export function marcumQ1Lookup(q: Float64Array, a: number, b: number): number {
  const { row, fraction } = marcumRow(b);
  return marcumQ1InRow(q, a, row, fraction);
}
