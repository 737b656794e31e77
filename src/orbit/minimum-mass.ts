import { DAY_SEC, GM_EARTH, GM_SUN } from '../astro/constants.js';

export interface MassFromKInput {
  starMassSun: number;
  kMps: number;
  periodDays: number;
  /** Eccentricity, 0 <= e < 1. */
  ecc?: number;
  /** Orbital inclination in degrees; omitted = 90 (edge-on), and the mass found is m sin i. */
  inclinationDeg?: number;
}

/**
 * The mass function times G, in m³/s²: G f = (G m_p sin i)³ / (G(M★ + m_p))² = P K³ (1 − e²)^(3/2) / 2π
 * (docs/references.md [Mass-function]; [CMB1999]).
 */
export function massFunctionGm(input: MassFromKInput): number {
  const { kMps, periodDays, ecc = 0 } = input;
  return (periodDays * DAY_SEC * kMps ** 3 * (1 - ecc * ecc) ** 1.5) / (2 * Math.PI);
}

function sinInclination(input: MassFromKInput): number {
  return Math.sin(((input.inclinationDeg ?? 90) * Math.PI) / 180);
}

/**
 * Planet mass (Earth masses) in the m_p ≪ M★ approximation,
 * m_p sin i ≈ K (P / 2πG)^(1/3) M★^(2/3) √(1 − e²): the mass function with M★ + m_p replaced by M★.
 */
export function planetMassFromKApproxEarth(input: MassFromKInput): number {
  const gmStar = input.starMassSun * GM_SUN;
  return (Math.cbrt(massFunctionGm(input)) * gmStar ** (2 / 3)) / sinInclination(input) / GM_EARTH;
}

/**
 * Planet mass (Earth masses) from K, exact: solves the mass function for m_p without assuming
 * m_p ≪ M★. Edge-on (no inclination given) this is the minimum mass m sin i.
 *
 * With y = m_p / M★ and c = (f / M★)^(1/3), the cube root of the mass function reads
 * r(y) = y sin i / (1 + y)^(2/3) = c. r is increasing and concave, so Newton's method started at the
 * approximation y0 = c / sin i (a lower bound) climbs to the root without overshooting; it is kept
 * inside the bracket [y0, max(1, 4c³/sin³i)] (where r >= c) with bisection as a safeguard.
 */
export function planetMassFromKEarth(input: MassFromKInput): number {
  const gmStar = input.starMassSun * GM_SUN;
  const sinI = sinInclination(input);
  const c = Math.cbrt(massFunctionGm(input) / gmStar);
  const residual = (y: number) => (y * sinI) / (1 + y) ** (2 / 3) - c;
  const slope = (y: number) => (sinI * (1 + y / 3)) / (1 + y) ** (5 / 3);
  let lo = c / sinI;
  let hi = Math.max(1, (4 * c ** 3) / sinI ** 3);
  let y = lo;
  for (let i = 0; i < 200; i++) {
    const r = residual(y);
    if (r === 0) break;
    if (r < 0) lo = y;
    else hi = y;
    let next = y - r / slope(y);
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    const step = Math.abs(next - y);
    y = next;
    if (step <= 1e-15 * y || hi - lo <= 1e-15 * hi) break;
  }
  return (y * gmStar) / GM_EARTH;
}
