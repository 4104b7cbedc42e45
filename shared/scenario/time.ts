import { z } from 'zod'

/** A scenario time: ISO 8601 with a zone (`2031-03-04T06:30:00Z`). */
export const scenarioTimeSchema = z.iso.datetime({ offset: true, message: 'expected an ISO 8601 date-time with a zone, e.g. 2031-03-04T06:30:00Z' })

/** Milliseconds since the epoch of a valid scenario time; NaN for anything else (so comparisons fail quietly). */
export function scenarioTime(iso: string): number {
  return scenarioTimeSchema.safeParse(iso).success ? Date.parse(iso) : Number.NaN
}
