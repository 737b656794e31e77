// Crest as a library: the public API. Everything here is a pure function of its arguments except
// the readers (io) and the writers, which touch files only where their names say so.

export type * from './model.js';
export type { Instrument, InstrumentReference } from './rv/instrument.js';
export type { Campaign, Goals, NoiseSettings, TransitAvoidance } from './plan/campaign.js';
export type { FittedOrbit } from './rv/fitted-orbit.js';
export type { ObservedVisit, OrbitUpdate, Plan, PlannedVisit, PlanTotals, Replan, TargetSummary, VisitPhase } from './plan/plan-schema.js';
export { CrestError, InputError, OutputError, ValidationError } from './errors.js';

// Input files
export { readCampaign } from './io/campaign.js';
export { readSite, parseSite } from './io/site.js';
export { readInstrument, parseInstrument } from './io/instrument.js';
export { readTargets, parseTargets } from './io/targets.js';
export { readRvSeries, parseRvSeries } from './io/rv-series.js';
export { readObserved, parseObserved, type ObservedRow } from './io/observed.js';
export { readBundledSites } from './io/site-list.js';
export { readPlan, planFromJson } from './io/plan-json.js';

// Orbits
export { semiAmplitudeMps } from './orbit/semi-amplitude.js';
export { planetMassFromKEarth, planetMassFromKApproxEarth } from './orbit/minimum-mass.js';
export { semiMajorAxisAu, periodDaysFromAu } from './orbit/kepler-third-law.js';
export { summarizeOrbit } from './orbit/summary.js';
export { eccentricAnomalyRad } from './orbit/kepler-equation.js';
export { radialVelocityMps } from './orbit/rv-curve.js';
export { periastronFromConjunctionBjdTdb } from './orbit/periastron-time.js';
export { phaseAt, phaseErrCycles, overlapsTransit } from './orbit/ephemeris.js';
export { signalShape } from './orbit/signal-shape.js';

// Sky
export { computeNights } from './sky/nights.js';
export { computeWindows } from './sky/visibility.js';
export { siteClock, preparePosition, altitudeDeg, airmassAt } from './sky/target-position.js';
export { kastenYoungAirmass } from './astro/airmass.js';
export { bjdTdb, starBjdTdb } from './astro/bjd.js';

// Precision and detectability
export { visitPrecision } from './rv/precision.js';
export { chooseExposureSec, visitCostSec } from './rv/exposure.js';
export { sigmaKMps, visitsNeeded, detectionProbability, detectionProbabilityKnownPhase, massLimitTable } from './rv/detect.js';
export { defaultJitter } from './rv/jitter.js';
export { targetDetectability } from './rv/target-detect.js';

// Blind search
export { glsPeriodogram } from './rv/periodogram.js';
export { searchPeriodogram } from './rv/periodogram-search.js';
export { frequencyGrid } from './rv/frequency-grid.js';
export { fapContext, falseAlarmProbability } from './rv/fap.js';
export { injectionRecovery } from './rv/injection.js';
export { fitOrbits, type FitPlanetPrior, type FitPoint, type OrbitFit, type PlanetFit } from './rv/orbit-fit.js';
export { blindPeak, BLIND_PEAK_FAP, type BlindPeak } from './rv/blind-peak.js';
export { createRng } from './rv/random.js';

// Scheduling and plans
export { optimiseSchedule } from './schedule/optimise.js';
export { simulateWeather } from './schedule/weather.js';
export { buildPlan } from './plan/build-plan.js';

// Output
export { renderPlanText } from './report/plan-terminal.js';
export { renderPlanMarkdown } from './report/plan-markdown.js';
export { renderPlanCsv } from './report/plan-csv.js';
export { renderPlanJson } from './report/plan-json.js';
export { renderPlanIcs, type PlanIcsOptions } from './report/plan-ics.js';
export { withIcsSequences } from './report/ics-sequence.js';
export { visitUids } from './report/ics-uid.js';
export { renderReportHtml } from './report/html/report-html.js';
export { checkOutFolder } from './io/out-folder.js';
export { writeOutputSet, recoverOutputSets } from './io/output-set.js';
