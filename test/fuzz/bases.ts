// The valid, tiny inputs the fuzz test mutates: one of each kind Crest reads. Every name and
// value is invented; the campaign is one night with two targets so that planning is fast.
import { renderPlanJson } from '../../src/report/plan-json.js';
import { fixturePlan } from '../report/fixture.js';

export const TARGETS_CSV = [
  '# invented stars',
  'id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,planetMsiniEarth,ecc,searchPeriodMinDays,searchPeriodMaxDays,searchMsiniEarth',
  'Orvel-2,10:12:30.5,-31:04:00,9.4,5300,4.217,2461000.52,12,0.1,,,',
  'Sanu,161.2,-22.5,8.1,4900,,,,,2,40,8',
  '"Tekla b",11:40:00,-12:30:00,10.2,5900,2.95,2461001.11,30,,,,',
  '',
].join('\n');

export const CAMPAIGN_YAML = [
  '# invented one-night campaign',
  'name: Fuzz run',
  'site: site.json',
  'instrument: instrument.json',
  'targets: targets.csv',
  'window: { start: 2027-03-01, end: 2027-03-02 }',
  'time: { mode: given-nights, dates: [2027-03-01] }',
  'constraints: { twilight: nautical, maxAirmass: 2.0, moonSeparationDeg: 30, minSpacingHours: 20 }',
  'goals: { significance: 5 }',
  'seed: 3',
  '',
].join('\n');

export const SITE_JSON = `${JSON.stringify(
  {
    id: 'cerro-fuzz',
    name: 'Cerro Fuzz (invented)',
    latitudeDeg: -29.3,
    longitudeDeg: -70.7,
    elevationM: 2400,
    timeZone: 'America/Santiago',
    minAltitudeDeg: 20,
    horizon: [
      { azimuthDeg: 0, altitudeDeg: 5 },
      { azimuthDeg: 180, altitudeDeg: 10 },
    ],
    clearFraction: [0.8, 0.8, 0.8, 0.75, 0.7, 0.6, 0.6, 0.65, 0.7, 0.8, 0.85, 0.85],
    semesters: { A: { start: '02-01', end: '07-31' }, B: { start: '08-01', end: '01-31' } },
    sourceNote: 'invented for the fuzz test',
  },
  null,
  2,
)}\n`;

export const INSTRUMENT_JSON = `${JSON.stringify(
  {
    id: 'fuzz-echelle',
    name: 'Fuzz echelle (invented)',
    apertureM: 1.93,
    resolvingPower: 75000,
    band: 'V',
    wavelengthNm: 550,
    coverageNm: [387, 694],
    spectralRegion: 'optical',
    reference: {
      photonSigmaMps: 1.43,
      mag: 8,
      exposureSec: 600,
      airmass: 1.2,
      seeingArcsec: 1.5,
      snrPerPixel: 117,
      teffK: 5800,
      vsiniKms: 2,
    },
    readNoiseE: 5,
    pixelsPerResolutionElement: 3.0,
    spatialPixels: 6,
    entrance: {
      kind: 'fibre',
      diameterArcsec: 3.0,
    },
    skyMagPerArcsec2: 21.3,
    floorMps: 1.5,
    readoutSec: 40,
    acquisitionSec: 180,
    minExposureSec: 120,
    maxExposureSec: 3600,
    extinctionMagPerAirmass: 0.15,
    sources: {
      apertureM: 'invented for the fuzz test',
      resolvingPower: 'invented for the fuzz test',
      coverageNm: 'invented for the fuzz test',
      reference: 'invented for the fuzz test',
      readNoiseE: 'invented for the fuzz test',
      pixelsPerResolutionElement: 'invented for the fuzz test',
      spatialPixels: 'invented for the fuzz test',
      entrance: 'invented for the fuzz test',
      skyMagPerArcsec2: 'invented for the fuzz test',
      floorMps: 'invented for the fuzz test',
      overheads: 'invented for the fuzz test',
      exposureLimits: 'invented for the fuzz test',
      extinctionMagPerAirmass: 'invented for the fuzz test',
    },
    sourceNote: 'invented for the fuzz test',
  },
  null,
  2,
)}\n`;

export const RV_CSV = [
  'bjdTdb,rvMps,rvErrorMps',
  ...[0, 1.1, 2.3, 4.0, 5.2, 7.9, 9.1, 12.6, 15.0, 18.4].map(
    (d, i) => `${(2461000.5 + d).toFixed(4)},${(3 * Math.sin(d)).toFixed(2)},${(1.5 + (i % 3) * 0.2).toFixed(1)}`,
  ),
  '',
].join('\n');

/** The report tests' invented plan, as plan.json. */
export const PLAN_JSON = renderPlanJson(fixturePlan());

/** Visits already made of the stars of TARGETS_CSV: BJD and UTC rows, with and without RVs. */
export const OBSERVED_CSV = [
  '# invented visits',
  'target,midBjdTdb,midUtc,instrument,rvMps,rvErrorMps',
  'Orvel-2,2461000.6123,,fuzz-echelle,-3.2,1.6',
  'Sanu,,2027-03-01T03:40:00Z,fuzz-echelle,,',
  '"Tekla b",,2027-03-01T05:10:30-03:00,fuzz-echelle,12.5,2.1',
  '',
].join('\n');
