// Invented campaigns at survey scale for the end-to-end bench: N candidates at one southern site
// (La Silla), 180 nights from 2027-03-01, choose 20. About 90% are stars with one known planet
// (an ephemeris from an invented transit survey: Tc within the first orbit of the window's
// start, small catalogue errors), the rest blind searches. Pure: the same seed gives the same
// two texts; the caller writes them (campaign.yaml beside targets.csv). Every name and value is made up.
import { createRng, type Rng } from '../src/rv/random.js';

export interface InventedCampaignSpec {
  candidates: number;
  seed: number;
  /** Fraction of blind-search stars (default 0.1). */
  searchFraction?: number;
}

export interface InventedCampaign {
  campaignYaml: string;
  targetsCsv: string;
}

/** The campaign's first night and its length: 2027-03-01 + 179 days = 2027-08-27. */
const WINDOW = { start: '2027-03-01', end: '2027-08-27' };
/** BJD_TDB near the window's start: 2027-03-01 00:00 UT is JD 2451545.0 (2000-01-01 12:00 UT) − 0.5 + 9,921 days. */
const EPOCH_BJD_TDB = 2461465.5;
const HEADER = 'id,ra,dec,vmag,teffK,periodDays,periodErrDays,tcBjdTdb,tcErrDays,planetMsiniEarth,searchPeriodMinDays,searchPeriodMaxDays,searchMsiniEarth';

const between = (rng: Rng, lo: number, hi: number) => lo + (hi - lo) * rng.uniform();
/** Log-uniform between lo and hi. */
const logBetween = (rng: Rng, lo: number, hi: number) => lo * (hi / lo) ** rng.uniform();

/** One star's row: declination uniform on the sphere between −80° and +20° (sin δ uniform), visible from the south. */
function starRow(rng: Rng, index: number, search: boolean): string {
  const id = `BNC-${String(index + 1).padStart(5, '0')}`;
  const raDeg = between(rng, 0, 360).toFixed(4);
  const decDeg = ((Math.asin(between(rng, Math.sin(-80 * (Math.PI / 180)), Math.sin(20 * (Math.PI / 180)))) * 180) / Math.PI).toFixed(3);
  const vmag = between(rng, 7, 12).toFixed(2);
  const teffK = Math.round(between(rng, 4000, 6300));
  if (search) return `${id},${raDeg},${decDeg},${vmag},${teffK},,,,,,2,60,10`;
  const periodDays = logBetween(rng, 1.5, 30);
  const tcBjdTdb = EPOCH_BJD_TDB - between(rng, 0, periodDays);
  const msiniEarth = logBetween(rng, 5, 60);
  return `${id},${raDeg},${decDeg},${vmag},${teffK},${periodDays.toFixed(5)},0.0003,${tcBjdTdb.toFixed(4)},0.002,${msiniEarth.toFixed(1)},,,`;
}

/** The campaign file and its target list for `spec` (targets.csv beside campaign.yaml). */
export function inventedCampaign(spec: InventedCampaignSpec): InventedCampaign {
  const rng = createRng(spec.seed);
  const searchFraction = spec.searchFraction ?? 0.1;
  const rows = Array.from({ length: spec.candidates }, (_, i) => starRow(rng, i, rng.uniform() < searchFraction));
  const campaignYaml = [
    `# Invented bench campaign: ${spec.candidates} candidates, seed ${spec.seed}.`,
    `name: bench ${spec.candidates}`,
    'site: la-silla',
    'instrument: stable-4m',
    'targets: targets.csv',
    `window: { start: ${WINDOW.start}, end: ${WINDOW.end} }`,
    'time: { mode: choose-nights, nights: 20 }',
    'constraints: { twilight: nautical, maxAirmass: 2.0, moonSeparationDeg: 30, minSpacingHours: 20 }',
    'goals: { significance: 5 }',
    `seed: ${spec.seed}`,
    '',
  ].join('\n');
  return { campaignYaml, targetsCsv: `${[HEADER, ...rows].join('\n')}\n` };
}
