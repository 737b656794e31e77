// Unit vectors and angles on the sphere (common practice).
export type Vec3 = [number, number, number];

const DEG = Math.PI / 180;

/** Unit vector towards right ascension and declination (degrees), equatorial axes. */
export function unitVectorFromRaDec(raDeg: number, decDeg: number): Vec3 {
  const ra = raDeg * DEG;
  const dec = decDeg * DEG;
  return [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
}

/** Right ascension (0..360) and declination (degrees) of a vector. */
export function raDecFromVector(v: Vec3): { raDeg: number; decDeg: number } {
  const raDeg = Math.atan2(v[1], v[0]) / DEG;
  return { raDeg: raDeg < 0 ? raDeg + 360 : raDeg, decDeg: Math.atan2(v[2], Math.hypot(v[0], v[1])) / DEG };
}

/** Angle between two vectors in degrees (atan2 form, accurate at all angles). */
export function angleBetweenDeg(a: Vec3, b: Vec3): number {
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  return Math.atan2(Math.hypot(cx, cy, cz), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]) / DEG;
}
