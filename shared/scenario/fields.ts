/**
 * Hazard fields in inject markdown: `{{ path }}` or `{{ path | unit }}`, replaced at display
 * time by the live figure of the current orbit solution's assessment. See README.md.
 */
import type { Assessment, Percentiles } from '../hazard/types'
import { FIELD_BY_PATH, HAZARD_FIELDS, UNIT_DISPLAY, UNITS, readField } from './catalogue'
import type { HazardFieldSpec } from './catalogue'
import { formatCount, formatFixed, formatOdds, formatPercent, formatSignificant } from './format'

export { HAZARD_FIELDS } from './catalogue'
export type { HazardFieldSpec } from './catalogue'

/** One `{{ … }}` occurrence in a text. Offsets are into the text; line and column 1-based. */
export interface HazardFieldRef {
  /** The whole occurrence, braces included. */
  raw: string
  /** The field path as written, e.g. `site.porto-salgado.runUpM.p95`. */
  path: string
  /** The unit after `|`, if any. */
  unit?: string
  start: number
  end: number
  line: number
  column: number
}

/** A problem with one hazard field, positioned like `HazardFieldRef`. */
export interface HazardFieldIssue {
  message: string
  start: number
  end: number
  line: number
  column: number
}

const PATH_RE = /^[A-Za-z0-9_-]+(?:\.[A-Za-z0-9_-]+)*$/

interface Token { kind: 'field' | 'escaped' | 'unclosed'; start: number; end: number; inner: string }

function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset)
  const line = before.split('\n').length
  return { line, column: offset - before.lastIndexOf('\n') }
}

/** Splits a text into `{{ … }}` tokens; `\{{` is a literal `{{`. */
function scan(text: string): Token[] {
  const tokens: Token[] = []
  let from = 0
  for (;;) {
    const start = text.indexOf('{{', from)
    if (start < 0) return tokens
    if (start > 0 && text[start - 1] === '\\') {
      tokens.push({ kind: 'escaped', start: start - 1, end: start + 2, inner: '' })
      from = start + 2
      continue
    }
    const close = text.indexOf('}}', start + 2)
    const nextOpen = text.indexOf('{{', start + 2)
    const lineEnd = text.indexOf('\n', start)
    if (close < 0 || (nextOpen >= 0 && nextOpen < close) || (lineEnd >= 0 && lineEnd < close)) {
      tokens.push({ kind: 'unclosed', start, end: start + 2, inner: '' })
      from = start + 2
      continue
    }
    tokens.push({ kind: 'field', start, end: close + 2, inner: text.slice(start + 2, close) })
    from = close + 2
  }
}

function toRef(text: string, t: Token): HazardFieldRef {
  const [path = '', unit, ...extra] = t.inner.split('|').map(s => s.trim())
  const ref: HazardFieldRef = {
    raw: text.slice(t.start, t.end), path: extra.length ? t.inner.trim() : path,
    start: t.start, end: t.end, ...lineColumn(text, t.start),
  }
  if (unit !== undefined && !extra.length) ref.unit = unit
  return ref
}

/** Every hazard field in a text, in order of appearance (escaped `\{{` excluded). */
export function findHazardFields(text: string): HazardFieldRef[] {
  return scan(text).filter(t => t.kind === 'field').map(t => toRef(text, t))
}

interface Resolved { spec: HazardFieldSpec; siteId?: string | undefined }

/** Looks a path up in the catalogue; `site.<id>.…` paths name their site. */
function resolve(path: string): Resolved | undefined {
  const parts = path.split('.')
  if (parts[0] === 'site' && parts.length >= 3) {
    const spec = FIELD_BY_PATH.get(['site', '<site>', ...parts.slice(2)].join('.'))
    return spec && { spec, siteId: parts[1] }
  }
  const spec = FIELD_BY_PATH.get(path)
  return spec && { spec }
}

function suggestion(path: string): string {
  const parts = path.split('.')
  const key = (parts[0] === 'site' && parts.length >= 3 ? ['site', '<site>', ...parts.slice(2)] : parts).join('.').toLowerCase()
  const hit = HAZARD_FIELDS.find(f => f.path.toLowerCase() === key)
  return hit ? ` (did you mean "${hit.path.replace('<site>', parts[1] ?? '<site>')}"?)` : ''
}

function unitList(spec: HazardFieldSpec): string {
  return spec.units.length ? `use ${spec.units.join(' or ')}` : 'it takes no unit'
}

/** Problems with the hazard fields of a text: malformed, unknown field, unknown site, wrong unit. */
export function validateHazardFields(text: string, siteIds: Iterable<string>): HazardFieldIssue[] {
  const sites = new Set(siteIds)
  const issues: HazardFieldIssue[] = []
  for (const t of scan(text)) {
    if (t.kind === 'escaped') continue
    const at = { start: t.start, end: t.end, ...lineColumn(text, t.start) }
    if (t.kind === 'unclosed') {
      issues.push({ ...at, message: 'unclosed hazard field "{{" (close it with "}}" on the same line, or write "\\{{" for literal braces)' })
      continue
    }
    const ref = toRef(text, t)
    if (!PATH_RE.test(ref.path) || ref.unit === '') {
      issues.push({ ...at, message: `malformed hazard field "${ref.raw}" (expected "{{ path }}" or "{{ path | unit }}")` })
      continue
    }
    const found = resolve(ref.path)
    if (!found) {
      issues.push({ ...at, message: `unknown hazard field "${ref.path}"${suggestion(ref.path)}` })
      continue
    }
    if (found.siteId !== undefined && !sites.has(found.siteId)) {
      issues.push({ ...at, message: `unknown site "${found.siteId}" in hazard field "${ref.path}"` })
    }
    if (ref.unit !== undefined && !found.spec.units.includes(ref.unit)) {
      issues.push({ ...at, message: `unit "${ref.unit}" does not apply to "${ref.path}" (${unitList(found.spec)})` })
    }
  }
  return issues
}

function isPercentiles(v: unknown): v is Percentiles {
  return typeof v === 'object' && v !== null && 'p50' in v
}

/** One number of a field in the requested unit, with the unit. */
function figure(x: number, spec: HazardFieldSpec, unit: string): string {
  switch (spec.dimension) {
    case 'magnitude': return `M ${formatFixed(x, 1)}`
    case 'torino': return String(Math.round(x))
    case 'palermo': return formatFixed(x, 2)
    case 'probability': return unit === 'odds' ? formatOdds(x) : formatPercent(x)
    case 'people': return `${formatCount(x, !spec.path.endsWith('.population'))} people`
    default: {
      const sizes = UNITS[spec.dimension]
      const value = x * (sizes[spec.unit] ?? 1) / (sizes[unit] ?? 1)
      return `${formatSignificant(value)} ${UNIT_DISPLAY[unit] ?? unit}`
    }
  }
}

/** A range "0.8–4.6 Mt" (the unit once, after the upper bound, unless it is a prefix). */
function range(p: Percentiles, spec: HazardFieldSpec, unit: string): string {
  const lo = figure(p.p5, spec, unit)
  const hi = figure(p.p95, spec, unit)
  if (spec.dimension === 'magnitude') return `${lo}–${hi.replace(/^M /, '')}`
  const suffix = ` ${UNIT_DISPLAY[unit] ?? unit}`
  return `${lo.endsWith(suffix) ? lo.slice(0, -suffix.length) : lo}–${hi}`
}

function renderOne(ref: HazardFieldRef, a: Assessment): string {
  const found = resolve(ref.path)
  if (!found) return `[unknown hazard field "${ref.path}"]`
  const { spec, siteId } = found
  if (siteId !== undefined && !a.sites.some(s => s.siteId === siteId)) return `[no figures for site "${siteId}"]`
  const unit = ref.unit !== undefined && spec.units.includes(ref.unit) ? ref.unit : spec.unit
  const value = readField(a, spec, siteId)
  if (value === null || value === undefined) return spec.whenMissing ?? 'n/a'
  if (typeof value === 'string') return value
  if (!isPercentiles(value)) return figure(value, spec, unit)
  const variant = spec.path.split('.').at(-1)
  if (variant === 'p5' || variant === 'p50' || variant === 'p95') return figure(value[variant], spec, unit)
  if (variant === 'range') return range(value, spec, unit)
  return `${figure(value.p50, spec, unit)} (5–95 %: ${range(value, spec, unit)})`
}

/**
 * A text with every hazard field replaced by its formatted figure from `assessment`:
 * `{{ energyMt }}` → "2.1 Mt (5–95 %: 0.8–4.6 Mt)", `{{ energyMt.p50 }}` → "2.1 Mt",
 * `{{ impactProbability }}` → "2.7 %". Unknown fields render as a bracketed notice; `\{{` as `{{`.
 */
export function renderHazardFields(text: string, assessment: Assessment): string {
  let out = ''
  let from = 0
  for (const t of scan(text)) {
    if (t.kind === 'unclosed') continue
    out += text.slice(from, t.start) + (t.kind === 'escaped' ? '{{' : renderOne(toRef(text, t), assessment))
    from = t.end
  }
  return out + text.slice(from)
}
