// Angles as sexagesimal text, the form of star catalogues and telescope control (common practice):
// right ascension in hours `hh:mm:ss.sss`, declination `±dd:mm:ss.ss`. src/io/sexagesimal.ts reads
// both forms back.

/** `whole:mm:ss.f…` from a non-negative amount in units of 1/10^digits of a second. */
function clockText(units: number, digits: number, wholeWidth: number): string {
  const perSecond = 10 ** digits;
  const whole = Math.floor(units / (3600 * perSecond));
  const minutes = Math.floor(units / (60 * perSecond)) % 60;
  const seconds = (units % (60 * perSecond)) / perSecond;
  const pad = (n: number, width: number) => String(n).padStart(width, '0');
  return `${pad(whole, wholeWidth)}:${pad(minutes, 2)}:${seconds.toFixed(digits).padStart(3 + digits, '0')}`;
}

/** Right ascension (deg) as `hh:mm:ss.sss` (1 ms of time is 15 mas). */
export function raText(raDeg: number): string {
  const perDay = 24 * 3600 * 1000;
  const units = ((Math.round((raDeg / 15) * 3600 * 1000) % perDay) + perDay) % perDay;
  return clockText(units, 3, 2);
}

/** Declination (deg) as `±dd:mm:ss.ss` (10 mas). */
export function decText(decDeg: number): string {
  const units = Math.round(Math.abs(decDeg) * 3600 * 100);
  return `${decDeg < 0 && units > 0 ? '-' : '+'}${clockText(units, 2, 2)}`;
}
