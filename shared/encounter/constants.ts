/** Constants of the encounter engine, in km, s and degrees (units in the names). Each one names its source. */

/**
 * Geocentric gravitational constant GM⊕, km³/s² (IERS Conventions 2010, Petit & Luzum eds., IERS Technical
 * Note 36, table 1.1: 3.986004418e14 m³/s²; from memory).
 */
export const MU_EARTH_KM3S2 = 398600.4418

/** Mean Earth radius R⊕, km (IUGG mean radius, Moritz 1980, Geodetic Reference System 1980; the hazard engine's value). */
export const EARTH_RADIUS_KM = 6371

/**
 * Escape speed at the surface, km/s: `sqrt(2 GM⊕ / R⊕)` = 11.186 km/s, the value of the issue (derived from the two
 * constants above, so that the capture radius and the entry speed use one consistent law).
 */
export const ESCAPE_SPEED_KMS = Math.sqrt(2 * MU_EARTH_KM3S2 / EARTH_RADIUS_KM)

/** Radians per degree. */
export const DEG = Math.PI / 180

/** Julian date of J2000.0, 2000 January 1, 12h TT (Meeus 1998, Astronomical Algorithms, 2nd ed., ch. 12 and 21). */
export const JD_J2000 = 2451545.0

/** Julian date of the Unix epoch 1970-01-01T00:00Z (Meeus 1998, ch. 7, eq. 7.1 evaluated for that date). */
export const JD_UNIX_EPOCH = 2440587.5

/** Milliseconds in one day. */
export const MS_PER_DAY = 86_400_000

/**
 * Radius of Earth's Hill sphere, km: `a (m⊕ / 3 M☉)^(1/3)` with a = 1 au = 1.496e8 km and m⊕/M☉ = 3.003e-6
 * (Hill-sphere formula, e.g. Murray & Dermott 1999, Solar System Dynamics, sect. 3.13; numbers from memory):
 * about 1.5 million km. Inside it the Earth's pull dominates the Sun's tide; outside, a two-body hyperbola about
 * the Earth is no longer a fair model of the path.
 */
export const HILL_RADIUS_KM = 1.496e8 * Math.cbrt(3.003e-6 / 3)

/**
 * Below this hyperbolic excess speed, km/s, the engine warns `low-v-inf`. Our choice (indicative): bodies this
 * slow approach the Earth almost co-orbitally; they are the regime of temporarily captured objects, whose paths
 * the Sun's tide shapes for weeks (Granvik, Vaubaillon & Jedicke 2012, Icarus 218, 262–277; from memory), the
 * capture radius passes 11 R⊕ and a b-plane point computed far out maps to a ground point only through a
 * full three-body propagation. It also keeps the entry speed above the orbit solution's 11.2 km/s floor
 * (v∞ >= 0.56 km/s is needed for that).
 */
export const LOW_V_INF_KMS = 1

/**
 * Above this time of flight from the Hill sphere to the entry sphere, days, the engine warns `long-approach`.
 * Our choice (indicative): in 7 days the Moon (sidereal period 27.32 d) moves through a quarter of its orbit and
 * the solar tide acts for a quarter of a month, so the two-body approach from the edge of the Hill sphere no longer
 * screens the path fairly; 7 days corresponds to v∞ of about 2.1 km/s (approachTimeS with b = 0).
 */
export const LONG_APPROACH_DAYS = 7

/**
 * Fewer hits than this among the samples: the engine warns `few-hits` (relative standard error of the impact
 * probability 1/sqrt(hits) above 10 %, binomial statistics; common practice, no source).
 */
export const FEW_HITS = 100
