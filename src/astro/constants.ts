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
