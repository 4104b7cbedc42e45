import dayjs from 'dayjs'
import utc from 'dayjs/plugin/utc'

dayjs.extend(utc)

/** A scenario time (ISO with a zone) as the value of a `datetime-local` input, in UTC with seconds. */
export function isoToInput(iso: string | undefined): string {
  const t = iso ? Date.parse(iso) : Number.NaN
  return Number.isNaN(t) ? '' : new Date(t).toISOString().slice(0, 19)
}

/** A `datetime-local` value read as UTC → `2031-03-04T21:40:00Z` ('' when empty). */
export function inputToIso(value: string): string {
  if (!value) return ''
  const base = value.length === 16 ? `${value}:00` : value.slice(0, 19)
  return `${base}Z`
}

/** `4 Mar 2031 06:30 UTC`. */
export function formatUtc(iso: string | null | undefined, withYear = true): string {
  if (!iso || Number.isNaN(Date.parse(iso))) return '—'
  return `${dayjs.utc(iso).format(withYear ? 'D MMM YYYY HH:mm' : 'D MMM HH:mm')} UTC`
}

/** `3 h 30 min` for a number of minutes. */
export function formatMinutes(minutes: number | null | undefined): string {
  if (minutes === null || minutes === undefined || !Number.isFinite(minutes)) return '—'
  const h = Math.floor(minutes / 60)
  const m = Math.round(minutes % 60)
  return h ? (m ? `${h} h ${m} min` : `${h} h`) : `${m} min`
}

/** Whole days between two scenario times (one decimal below ten days). */
export function spanDays(fromIso: string, toIso: string): number | null {
  const ms = Date.parse(toIso) - Date.parse(fromIso)
  if (!Number.isFinite(ms)) return null
  const days = ms / 86_400_000
  return days < 10 ? Math.round(days * 10) / 10 : Math.round(days)
}
