/** Small formatters of the review desk and the printable report (UTC throughout). */

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']

/** "4 Mar 2031 06:30 UTC", with seconds ("06:30:12") or without the year when asked. */
export function utcText(iso: string | null | undefined, opts: { seconds?: boolean; year?: boolean } = {}): string {
  if (!iso) return '—'
  const d = new Date(iso)
  if (Number.isNaN(d.getTime())) return '—'
  const p = (n: number) => String(n).padStart(2, '0')
  const time = `${p(d.getUTCHours())}:${p(d.getUTCMinutes())}${opts.seconds ? `:${p(d.getUTCSeconds())}` : ''}`
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}${opts.year === false ? '' : ` ${d.getUTCFullYear()}`} ${time} UTC`
}

/** A share 0..1 as a whole percentage ("35 %"), or "—". */
export function percentText(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '—' : `${Math.round(x * 100)} %`
}

/** Event types of the record in plain words, for filters and legends. */
export const EVENT_TYPE_LABELS: Record<string, string> = {
  'clock.changed': 'Clock',
  'solution.published': 'Orbit solution',
  'inject.released': 'Inject released',
  'message.sent': 'Message',
  'inject.revised': 'Figures revised',
  'inject.held': 'Inject held',
  'response.submitted': 'Response',
  'score.recorded': 'Rating',
  'observation.recorded': 'Observation',
  'team.message': 'Message from a team',
  'zone.drawn': 'Zone drawn',
  'zone.withdrawn': 'Zone withdrawn',
}
