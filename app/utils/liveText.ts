// Words and numbers of the live desks: scenario times, spans, clock speed, ratings.
import dayjs from 'dayjs'
import timezone from 'dayjs/plugin/timezone'
import utc from 'dayjs/plugin/utc'
import type { ExerciseStatus, Rating } from '~~/shared/live/types'
import { offsetText, zonedText } from '~~/shared/utils/zone'
import { RATING_LABELS } from '~~/shared/review/plan'

dayjs.extend(utc)
dayjs.extend(timezone)

const ms = (t: number | string) => (typeof t === 'number' ? t : Date.parse(t))
const ZONE_KEY = 'bw-scenario-zone'

/**
 * The time zone of the scenario on this page (IANA; `UTC` until a desk, the wall, the editor or the brief sets it):
 * scenario times show local time with UTC beside it.
 */
export function scenarioZone(): string {
  try { return tryUseNuxtApp() ? useState<string>(ZONE_KEY, () => 'UTC').value : 'UTC' }
  catch { return 'UTC' }
}
/** Sets the page's scenario time zone (from the scenario's `clock.timeZone`). */
export function setScenarioZone(zone: string | null | undefined): void {
  useState<string>(ZONE_KEY, () => 'UTC').value = zone || 'UTC'
}
const inZone = (t: number | string) => dayjs(ms(t)).tz(scenarioZone())

/** `Thu 4 Mar 2031` (local to the scenario). */
export const scenarioDay = (t: number | string) => inZone(t).format('ddd D MMM YYYY')
/** `09:00:12` (local to the scenario). */
export const scenarioClockText = (t: number | string) => inZone(t).format('HH:mm:ss')
/** `09:00:12` in UTC. */
export const scenarioUtcClockText = (t: number | string) => dayjs.utc(ms(t)).format('HH:mm:ss')
/** The scenario's offset from UTC at a moment: `UTC+1`; `UTC` in a UTC scenario. */
export const scenarioOffset = (t: number | string) => (scenarioZone() === 'UTC' ? 'UTC' : offsetText(ms(t), scenarioZone()))
/** `4 Mar 10:00`: scenario local time alone, for narrow columns (give the full scenarioStamp as a title beside it). */
export const scenarioShort = (t: number | string) => inZone(t).format('D MMM HH:mm')
/** `4 Mar 10:00 (UTC+1) · 09:00 UTC` (`4 Mar 09:00 UTC` in a UTC scenario), with the year when asked. */
export const scenarioStamp = (t: number | string, withYear = false) => zonedText(ms(t), scenarioZone(), { year: withYear })
/** Local wall time `14:32` (the room's own clock). */
export const wallHm = (t: number | string) => dayjs(ms(t)).format('HH:mm')
/** Local wall time `14:32:05`. */
export const wallHms = (t: number | string) => dayjs(ms(t)).format('HH:mm:ss')

/** A span of time in words at the useful precision: `3 d 4 h`, `8 h 40 min`, `12 min`, `40 s`. */
export function spanText(span: number): string {
  const s = Math.max(0, Math.round(Math.abs(span) / 1000))
  const d = Math.floor(s / 86_400), h = Math.floor((s % 86_400) / 3600), m = Math.floor((s % 3600) / 60)
  if (d >= 10) return `${d} d`
  if (d) return h ? `${d} d ${h} h` : `${d} d`
  if (h) return m ? `${h} h ${m} min` : `${h} h`
  if (m) return `${m} min`
  return `${s} s`
}

/** `×1,364`. */
export const factorText = (f: number) => `×${Math.round(f).toLocaleString('en-GB')}`

/** What one wall minute is worth at a speed: `1 wall minute = 22.7 scenario hours`. */
export function paceText(f: number): string {
  const scenarioMin = f
  const [value, unit] = scenarioMin >= 2880 ? [scenarioMin / 1440, 'days'] : scenarioMin >= 120 ? [scenarioMin / 60, 'hours'] : [scenarioMin, 'minutes']
  const shown = value >= 100 ? Math.round(value).toLocaleString('en-GB') : String(Number(value.toPrecision(3)))
  return `1 wall minute = ${shown} scenario ${shown === '1' ? unit.slice(0, -1) : unit}`
}

export const STATUS_WORDS: Record<ExerciseStatus, string> = {
  planned: 'Ready to start',
  running: 'Running',
  paused: 'Paused',
  ended: 'Ended',
}

/** The four ratings of a critical task, in words (one wording: shared/review/plan.ts). */
export const RATING_MEANINGS: Record<Rating, string> = RATING_LABELS

/** Inject kinds in words: `decision-request` → `Decision request`. */
export const kindText = (kind: string) => (kind.charAt(0).toUpperCase() + kind.slice(1)).replaceAll('-', ' ')
