import dayjs from 'dayjs'
import utc from 'dayjs/plugin/utc'

dayjs.extend(utc)

/** A scenario time (ISO) as typed in a time field: `2031-03-04 06:30` (`:ss` when not zero), UTC, 24-hour. */
export function isoToText(iso: string | undefined): string {
  const t = iso ? Date.parse(iso) : Number.NaN
  if (Number.isNaN(t)) return ''
  const s = new Date(t).toISOString()
  return s.slice(17, 19) === '00' ? `${s.slice(0, 10)} ${s.slice(11, 16)}` : `${s.slice(0, 10)} ${s.slice(11, 19)}`
}

/** A typed time `2031-03-04 06:30[:ss]` (or with a T) read as UTC → `2031-03-04T06:30:00Z`; '' when empty; null when not a time. */
export function textToIso(text: string): string | null {
  const v = text.trim()
  if (!v) return ''
  const m = /^(\d{4})-(\d{2})-(\d{2})[ T](\d{2}):(\d{2})(?::(\d{2}))?Z?$/.exec(v)
  if (!m) return null
  const [, y, mo, d, h, mi, s = '00'] = m
  const iso = `${y}-${mo}-${d}T${h}:${mi}:${s}Z`
  const t = Date.parse(iso)
  // Reject a day or hour that rolls over (2031-02-30, 24:10).
  return !Number.isNaN(t) && new Date(t).toISOString().slice(0, 19) === iso.slice(0, 19) ? iso : null
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
