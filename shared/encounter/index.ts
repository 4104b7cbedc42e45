/**
 * Brinkwater encounter engine: the public face. Pure TypeScript (no Nuxt, Node or browser API) that turns a close
 * encounter given on the target plane (b-plane) into entry conditions, ground points and the encounter part of an
 * orbit solution for the hazard engine. Physics, conventions and sources: shared/encounter/README.md.
 */
export * from './constants'
export { julianDateUtc, greenwichSiderealDeg, greenwichSiderealRad, timeMs } from './sidereal'
export type { TimeInput } from './sidereal'
export {
  bPlaneAxes, captureRadiusKm, entrySpeedKmS, entryFromBPlane, findBPlanePoint, approachTimeS, turnAngleRad,
  encounterFrame, entryUnitInto, groundLonLat, arrivalTimeS, EARTH_ROTATION_RAD_S,
} from './bplane'
export type { Radiant, BPlanePoint, BPlaneEntry, BPlaneEntryInput, EncounterFrame, FindBPlaneInput } from './bplane'
export { EncounterSampler, MIN_ENCOUNTER_HIT_SHARE, erfc, normalMass, truncatedStandardNormal } from './draw'
export type { DrawEncounter, EncounterHit } from './draw'
export { solutionFromEncounter, corridorFromHits, lineTrack, lineOfVariationsTrack, CORRIDOR_POINTS, MAX_SAMPLES } from './solution'
export type { EncounterInput, EncounterOptions, EncounterSolution, EncounterSolutionPart, EncounterWarning } from './solution'
