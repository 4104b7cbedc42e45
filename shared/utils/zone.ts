/**
 * Scenario times in the scenario's own time zone (an IANA name, e.g. Europe/Lisbon) with UTC beside them. Pure:
 * the platform's Intl time-zone data, the same in Node and the browser. Pages format with dayjs's timezone plugin,
 * which reads the same data.
 */

/** Whether a name is a time zone this platform knows (IANA, e.g. `Europe/Lisbon`, or `UTC`). */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: name })
    return true
  }
  catch { return false }
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']

const formats = new Map<string, Intl.DateTimeFormat>()
function parts(t: number, zone: string): Record<string, string> {
  let f = formats.get(zone)
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone: zone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: '2-digit', minute: '2-digit',
      timeZoneName: 'shortOffset',
    })
    formats.set(zone, f)
  }
  return Object.fromEntries(f.formatToParts(t).map(p => [p.type, p.value]))
}

/** The zone's offset from UTC at a moment: `UTC+1`, `UTC−3:30`, `UTC+0`. */
export function offsetText(t: number, zone: string): string {
  const name = parts(t, zone).timeZoneName ?? 'GMT'
  return name === 'GMT' ? 'UTC+0' : name.replace('GMT', 'UTC').replace('-', '−')
}

/**
 * `4 Mar 2031 07:30 (UTC+1) · 06:30 UTC`: local time first, UTC beside it; in a UTC scenario only `… UTC`.
 * `year: false` leaves the year out.
 */
export function zonedText(iso: string | number | null | undefined, zone = 'UTC', opts: { year?: boolean } = {}): string {
  const t = typeof iso === 'number' ? iso : iso ? Date.parse(iso) : Number.NaN
  if (Number.isNaN(t)) return '—'
  const d = new Date(t)
  const pad = (n: number) => String(n).padStart(2, '0')
  const utc = `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`
  const p = parts(t, zone)
  if (zone === 'UTC' || zone === 'Etc/UTC') {
    return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}${opts.year === false ? '' : ` ${d.getUTCFullYear()}`} ${utc}`
  }
  const day = `${Number(p.day)} ${MONTHS[Number(p.month) - 1]}${opts.year === false ? '' : ` ${p.year}`}`
  return `${day} ${p.hour}:${p.minute} (${offsetText(t, zone)}) · ${utc}`
}

/** `2031-09-08 05:17:26 UTC+1`: local time in a sortable form, for tables and exports. */
export function localIsoText(t: number, zone = 'UTC'): string {
  const f = new Intl.DateTimeFormat('en-CA', {
    timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit',
  })
  const p = Object.fromEntries(f.formatToParts(t).map(x => [x.type, x.value]))
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}:${p.second} ${zone === 'UTC' ? 'UTC' : offsetText(t, zone)}`
}
