// A site's local horizon: altitude as a function of azimuth.
import type { HorizonPoint } from '../model.js';

/**
 * Altitude (deg) of the horizon mask at an azimuth (north = 0, east = 90): linear interpolation
 * between the points, sorted by azimuth, wrapping from the last point to the first through north.
 */
export function maskAltitudeDeg(mask: HorizonPoint[], azimuthDeg: number): number {
  const first = mask[0]!;
  const last = mask[mask.length - 1]!;
  for (let i = 1; i < mask.length; i++) {
    const a = mask[i - 1]!;
    const b = mask[i]!;
    if (azimuthDeg >= a.azimuthDeg && azimuthDeg <= b.azimuthDeg) {
      const span = b.azimuthDeg - a.azimuthDeg;
      return span === 0 ? Math.max(a.altitudeDeg, b.altitudeDeg) : a.altitudeDeg + ((b.altitudeDeg - a.altitudeDeg) * (azimuthDeg - a.azimuthDeg)) / span;
    }
  }
  // Between the last point and the first, through north.
  const gap = first.azimuthDeg + 360 - last.azimuthDeg;
  const along = azimuthDeg >= last.azimuthDeg ? azimuthDeg - last.azimuthDeg : azimuthDeg + 360 - last.azimuthDeg;
  return gap === 0 ? last.altitudeDeg : last.altitudeDeg + ((first.altitudeDeg - last.altitudeDeg) * along) / gap;
}
