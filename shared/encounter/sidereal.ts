import { DEG, JD_J2000, JD_UNIX_EPOCH, MS_PER_DAY } from './constants'

/** A time as an ISO 8601 string with an offset, a Date, or milliseconds since 1970-01-01T00:00Z. */
export type TimeInput = string | Date | number

/**
 * Milliseconds since 1970-01-01T00:00Z of a time input; throws a RangeError on an unparsable or missing time.
 * @param timeUtc ISO 8601 string with an offset (e.g. `2031-05-04T12:00:00Z`), Date or epoch milliseconds
 */
export function timeMs(timeUtc: TimeInput): number {
  const ms = typeof timeUtc === 'number' ? timeUtc : typeof timeUtc === 'string' ? Date.parse(timeUtc) : timeUtc.getTime()
  if (!Number.isFinite(ms)) throw new RangeError(`not a valid time: ${String(timeUtc)}`)
  return ms
}

/**
 * Julian date of a UTC time: `JD = ms / 86 400 000 + 2 440 587.5` (Meeus 1998, Astronomical Algorithms, 2nd ed., ch. 7).
 * UTC stands in for UT1: |UT1 - UTC| < 0.9 s moves the Earth by less than 0.004° (IERS; common practice).
 */
export function julianDateUtc(timeUtc: TimeInput): number {
  return timeMs(timeUtc) / MS_PER_DAY + JD_UNIX_EPOCH
}

/**
 * Greenwich mean sidereal time, degrees in [0, 360):
 * `θ0 = 280.46061837 + 360.98564736629 (JD - 2451545.0) + 0.000387933 T² - T³ / 38 710 000`, T in Julian centuries
 * from J2000.0. Source: Meeus 1998, Astronomical Algorithms, 2nd ed., ch. 12, eq. 12.4 (IAU 1982 expression of
 * Aoki et al. 1982). Mean, not apparent: the nutation term (< 1.2 s of time, < 0.005°) is left out.
 * @param timeUtc the instant (UTC used for UT1)
 * @returns GMST, degrees
 */
export function greenwichSiderealDeg(timeUtc: TimeInput): number {
  const d = julianDateUtc(timeUtc) - JD_J2000
  const T = d / 36525
  // The day count is split so that 360.98564736629 d loses no precision: 360 d is a whole number of turns when d is.
  const whole = Math.floor(d), frac = d - whole
  const deg = 280.46061837 + 0.98564736629 * d + 360 * frac + 0.000387933 * T * T - T * T * T / 38_710_000
  return ((deg % 360) + 360) % 360
}

/** Greenwich mean sidereal time in radians (see greenwichSiderealDeg). */
export function greenwichSiderealRad(timeUtc: TimeInput): number {
  return greenwichSiderealDeg(timeUtc) * DEG
}
