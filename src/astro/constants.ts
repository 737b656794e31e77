// Physical and astronomical constants, each with its source.

/** IAU 2015 Resolution B3, nominal solar mass parameter (m^3 s^-2). */
export const GM_SUN = 1.3271244e20;
/** IAU 2015 Resolution B3, nominal terrestrial mass parameter (m^3 s^-2). */
export const GM_EARTH = 3.986004e14;
/** IAU 2015 Resolution B3, nominal Jovian mass parameter (m^3 s^-2). */
export const GM_JUPITER = 1.2668653e17;
/** CODATA 2018 Newtonian constant of gravitation (m^3 kg^-1 s^-2). */
export const G_SI = 6.6743e-11;
/** IAU 2012 Resolution B2, astronomical unit (m). */
export const AU_M = 149_597_870_700;
/** SI definition, speed of light (m/s). */
export const C_MPS = 299_792_458;
/** Seconds per day (SI day of 86 400 s). */
export const DAY_SEC = 86_400;
/** Julian year in days. */
export const JULIAN_YEAR_DAYS = 365.25;
/** Earth masses per solar mass, from the nominal mass parameters above. */
export const EARTH_PER_SUN = GM_SUN / GM_EARTH;
/** Earth masses per Jupiter mass, from the nominal mass parameters above. */
export const EARTH_PER_JUPITER = GM_JUPITER / GM_EARTH;
/** Julian date of the J2000.0 epoch (2000 January 1, 12h TT). */
export const JD_J2000 = 2_451_545.0;
/** Ratio of the sidereal to the solar rotation rate of the Earth (IAU 1982 GMST expression; Meeus 1998, eq. 12.4). */
export const SIDEREAL_PER_SOLAR = 1.002_737_909_35;
/** Milliseconds per day. */
export const DAY_MS = 86_400_000;
/** Julian date of the Unix epoch 1970-01-01T00:00:00 UTC. */
export const JD_UNIX_EPOCH = 2_440_587.5;
/** TT - TAI in seconds (IAU 1991 Resolution A4). */
export const TT_MINUS_TAI_SEC = 32.184;
/** Sunrise and sunset: the Sun's centre at -0.833 deg (34' refraction plus 16' semidiameter; the almanac convention). */
export const SUNRISE_ALTITUDE_DEG = -0.833;
/** Twilight levels: the Sun's centre at -6, -12 and -18 deg (the almanac convention). */
export const TWILIGHT_ALTITUDE_DEG = { civil: -6, nautical: -12, astronomical: -18 } as const;
