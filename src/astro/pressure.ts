// Air pressure at a site's elevation, for the refraction of star altitudes.

/** Sea-level pressure of the standard atmosphere (hPa) [USSA1976]. */
const SEA_LEVEL_PRESSURE_HPA = 1013.25;

/**
 * Pressure (hPa) at `elevationM` above sea level: the barometric formula of the standard
 * atmosphere's lowest layer, P = P0 (1 − L h / T0)^(g0 M / (R* L)) with T0 = 288.15 K,
 * L = 0.0065 K/m and exponent 5.25588 (docs/references.md [USSA1976]); valid to 11 km.
 */
export function pressureHpaAtElevation(elevationM: number): number {
  return SEA_LEVEL_PRESSURE_HPA * (1 - (0.0065 * elevationM) / 288.15) ** 5.25588;
}
