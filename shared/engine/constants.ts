/**
 * Physical constants and unit conversions used across the engine.
 *
 * Sources: IAU 2015 Resolution B3 nominal solar values (Prša et al. 2016, AJ 152, 41);
 * IAU 2012 Resolution B2 for the astronomical unit; CODATA 2018 for G; the Jupiter
 * values are the IAU 2015 nominal equatorial radius and mass parameter.
 * Everything is cgs unless the name says otherwise.
 */

/** Newton's constant, cm^3 g^-1 s^-2 (CODATA 2018). */
export const G_CGS = 6.6743e-8;
/** Nominal solar mass parameter GM_sun, cm^3 s^-2 (IAU 2015 B3). */
export const GM_SUN_CGS = 1.3271244e26;
/** Solar mass in g, derived as GM_sun / G so both stay consistent. */
export const MSUN_G = GM_SUN_CGS / G_CGS;
/** Nominal solar radius, cm (IAU 2015 B3). */
export const RSUN_CM = 6.957e10;
/** Nominal solar luminosity, erg s^-1 (IAU 2015 B3). */
export const LSUN_ERG_S = 3.828e33;
/** Astronomical unit, cm (IAU 2012 B2, exact). */
export const AU_CM = 1.495978707e13;
/** Jupiter mass in solar masses (IAU 2015 B3 nominal GM_J / GM_sun). */
export const MJUP_MSUN = 1.2668653e23 / GM_SUN_CGS;
/** Nominal equatorial radius of Jupiter in solar radii (IAU 2015 B3: 7.1492e9 cm). */
export const RJUP_RSUN = 7.1492e9 / RSUN_CM;
/** Solar radii per AU. */
export const RSUN_PER_AU = AU_CM / RSUN_CM;
/** Seconds in a Julian year (IAU). */
export const YEAR_S = 365.25 * 86400;
/** Seconds in a day. */
export const DAY_S = 86400;
/** Gaussian gravitational constant k, AU^(3/2) Msun^(-1/2) day^-1 (IAU 1976 defining constant). */
export const GAUSS_K = 0.01720209895;
