/**
 * The map as a standalone SVG string (no DOM, no Vue): for PDF reports and printable briefs on the
 * server. Carries the drill marking, a legend in plain words and the basis of the footprints (or, for assessments
 * without footprints, of the rings).
 */
import { DRILL_MARKING } from '../utils/drill'
import {
  FOOTPRINT_LEVEL_WORDS, POINT_LABELS, footprintLineText, footprintName, footprintShadingText, ringBasisText, ringLabel, toneLabel,
} from './legend'
import type { MedianBlastCase, RunUpClass } from './overlays'
import { MAP_PALETTES, RING_DASH, footprintKind, siteGlyph } from './palette'
import { buildScene, pointsPath, type PointKind, type SceneInput } from './scene'
import { placeLabels } from './labels'
import { geoPath } from 'd3-geo'
import { destination } from './sphere'
import { zoneKindLabel, zoneOutline, type ZoneKind, type ZoneShape } from './zones'

export interface RenderMapOptions extends Omit<SceneInput, 'padding'> {
  theme?: 'light' | 'dark'
  title?: string
  /** The drill marking printed across the top; defaults to DRILL_MARKING. */
  marking?: string
  /** Median case of the rings (or of the footprints' thin lines), for the legend (omit when none are drawn). */
  ringBasis?: MedianBlastCase | null
  legend?: boolean
  fontFamily?: string
  /** Protective-action zones to outline and name. */
  zones?: ReadonlyArray<{ kind: ZoneKind; name: string; shape: ZoneShape }>
}

export function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')
}

const MARK_H = 28

/** Renders the whole map to an SVG document string. */
export function renderMapSvg(o: RenderMapOptions): string {
  const c = MAP_PALETTES[o.theme ?? 'light']
  const font = o.fontFamily ?? '\'IBM Plex Sans\', system-ui, sans-serif'
  const scene = buildScene({ ...o, padding: { top: MARK_H + 16, right: 24, bottom: 24, left: 24 } })
  const { width: w, height: h } = scene
  const out: string[] = []
  const push = (s: string) => out.push(s)
  const title = o.title ?? 'Risk corridor map'
  push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${w} ${h}" width="${w}" height="${h}" role="img" aria-labelledby="map-title" font-family="${escapeXml(font)}">`)
  push(`<title id="map-title">${escapeXml(`${title} — ${o.marking ?? DRILL_MARKING}`)}</title>`)
  push(`<rect width="${w}" height="${h}" fill="${c.sea}"/>`)
  push(`<path class="graticule" d="${scene.graticule}" fill="none" stroke="${c.graticule}" stroke-opacity="0.5" stroke-width="0.6"/>`)
  if (scene.land) push(`<path class="land" d="${scene.land}" fill="${c.land}" stroke="${c.coast}" stroke-width="0.7"/>`)
  if (scene.borders) push(`<path class="borders" d="${scene.borders}" fill="none" stroke="${c.borders}" stroke-width="0.6" stroke-dasharray="3 2"/>`)
  // Footprints under the corridors, so the band stays on top of the shading.
  for (const f of scene.footprints) {
    const paint = c.footprint[footprintKind(f.key)]
    f.levels.forEach((l, i) => {
      const [fill, opacity] = paint.fills[Math.min(i, paint.fills.length - 1)]!
      push(`<path class="footprint" data-footprint="${escapeXml(f.key)}" data-probability="${l.probability}" d="${l.d}" fill="${fill}" fill-opacity="${opacity}"/>`)
    })
  }
  // The coast again over the shading, so it stays visible through the footprint.
  if (scene.land && scene.footprints.length) push(`<path class="coast" d="${scene.land}" fill="none" stroke="${c.coast}" stroke-width="0.7"/>`)
  for (const k of scene.corridors) {
    if (k.current) push(`<path class="corridor corridor-current" data-corridor="current" d="${k.band}" fill="${c.corridor}" fill-opacity="0.22" stroke="${c.corridorEdge}" stroke-width="1.5"/>`)
    else push(`<path class="corridor corridor-earlier" data-corridor="earlier" d="${k.band}" fill="none" stroke="${c.earlier}" stroke-opacity="0.6" stroke-width="1" stroke-dasharray="5 4"/>`)
  }
  const cur = scene.corridors.find(k => k.current)
  if (cur) push(`<path class="track" d="${cur.track}" fill="none" stroke="${c.corridorEdge}" stroke-width="1" stroke-dasharray="1 3"/>`)
  const kinds: PointKind[] = ['sea', 'land', 'air']
  for (const kind of kinds) {
    const d = pointsPath(scene.points, kind)
    if (!d) continue
    if (kind === 'sea') push(`<path class="points points-sea" d="${d}" stroke="${c.points.sea}" stroke-width="3" stroke-linecap="round" stroke-opacity="0.55"/>`)
    else if (kind === 'land') push(`<path class="points points-land" d="${d}" fill="${c.points.land}" fill-opacity="0.7"/>`)
    else push(`<path class="points points-air" d="${d}" fill="none" stroke="${c.points.air}" stroke-width="0.9"/>`)
  }
  for (const r of scene.probabilistic ? scene.rings : []) {
    const line = c.footprint[footprintKind(r.key)].line
    push(`<path class="nominal-line" data-nominal="${escapeXml(r.key)}" d="${r.d}" fill="none" stroke="${line}" stroke-width="1.1"/>`)
  }
  for (const f of scene.footprints) {
    if (f.labelAt) push(text(footprintName(f.key), f.labelAt[0], f.labelAt[1] - 9, 'middle', 11, c.footprint[footprintKind(f.key)].line, c.halo, 'footprint-label', '600'))
  }
  for (const r of scene.probabilistic ? [] : scene.rings) {
    push(`<path class="ring" data-ring="${r.key}" d="${r.d}" fill="none" stroke="${c.ring}" stroke-width="1.6" stroke-dasharray="${RING_DASH[r.key] ?? ''}"/>`)
    if (r.labelAt) push(text(
      ringLabel(r),
      r.labelAt[0],
      r.labelAt[1] + (r.labelSide === 'top' ? -8 : 8),
      'middle',
      11,
      c.ring,
      c.halo,
      'ring-label',
    ))
  }
  if (scene.nominal) {
    const [x, y] = scene.nominal
    push(`<path class="nominal" d="M${x - 6} ${y}h12M${x} ${y - 6}v12" stroke="${c.text}" stroke-width="2"/>`)
  }
  // Zones: outline by kind (evacuate coral, shelter tide, keep out ink; each with its own dash), named above their top.
  const zonePath = geoPath(scene.projection).digits(1)
  for (const z of o.zones ?? []) {
    const stroke = z.kind === 'evacuate' ? c.ring : z.kind === 'shelter' ? c.points.sea : c.text
    const dash = z.kind === 'shelter' ? '7 3' : z.kind === 'exclusion' ? '2 3' : ''
    push(`<path class="zone" data-zone="${z.kind}" d="${zonePath(zoneOutline(z.shape)) ?? ''}" fill="${stroke}" fill-opacity="0.1" stroke="${stroke}" stroke-width="1.6" stroke-dasharray="${dash}"/>`)
    const tops = (z.shape.type === 'circle' ? [destination(z.shape.centre, 0, z.shape.radiusKm)] : z.shape.ring)
      .map(p => scene.projection(p)).filter((p): p is [number, number] => !!p)
    if (tops.length) {
      const x = z.shape.type === 'circle' ? scene.projection(z.shape.centre)?.[0] ?? tops[0]![0] : (Math.min(...tops.map(t => t[0])) + Math.max(...tops.map(t => t[0]))) / 2
      push(text(`${zoneKindLabel(z.kind)}: ${z.name}`, x, Math.min(...tops.map(t => t[1])) - 9, 'middle', 11, c.text, c.halo, 'zone-label', '600'))
    }
  }
  const order = [...scene.sites].sort((a, b) => b.population - a.population)
  const labels = placeLabels(
    order.map(s => ({ id: s.id, x: s.x, y: s.y, text: s.name })),
    { width: w, height: h, fontPx: 12, markerPx: 6, blocked: [{ x0: 0, y0: 0, x1: w, y1: MARK_H + 4 }] },
  )
  for (const s of scene.sites) {
    push(`<path class="site" data-site="${escapeXml(s.id)}" d="${siteGlyph(s.tone, s.x, s.y, 5)}" fill="${c.site[s.tone]}" stroke="${c.siteEdge}" stroke-width="1.2"/>`)
    const at = labels.get(s.id)
    if (at) push(text(s.name, at.x, at.y, at.anchor, 12, c.text, c.halo, 'site-label'))
  }
  if (o.legend !== false) push(legend(
    o,
    scene.points.map(p => p.kind),
    scene.corridors.length > 1,
    scene.probabilistic ? [] : scene.rings.map(r => r.key),
    [...new Set(scene.sites.map(s => s.tone))],
    c,
    h,
    scene.probabilistic ? (o.footprints ?? []).map(f => f.key) : null,
  ))
  push(`<rect width="${w}" height="${MARK_H}" fill="${c.marking}"/>`)
  push(text(o.marking ?? DRILL_MARKING, w / 2, MARK_H / 2, 'middle', 14, c.markingText, null, 'marking', 'bold', '0.3em'))
  push('</svg>')
  return out.join('\n')
}

function text(
  s: string,
  x: number,
  y: number,
  anchor: string,
  size: number,
  fill: string,
  halo: string | null,
  cls = '',
  weight = 'normal',
  spacing = '0',
): string {
  const h = halo ? ` stroke="${halo}" stroke-width="3" stroke-linejoin="round" paint-order="stroke"` : ''
  return `<text class="${cls}" x="${Math.round(x * 10) / 10}" y="${Math.round(y * 10) / 10}" text-anchor="${anchor}" dominant-baseline="central" font-size="${size}" font-weight="${weight}" letter-spacing="${spacing}" fill="${fill}"${h}>${escapeXml(s)}</text>`
}

function legend(
  o: RenderMapOptions,
  kinds: PointKind[],
  earlier: boolean,
  rings: string[],
  tones: RunUpClass[],
  c: typeof MAP_PALETTES.light,
  h: number,
  footprints: string[] | null,
): string {
  const rows: Array<{ glyph: string; label: string }> = []
  rows.push({
    glyph: `<rect x="0" y="-5" width="18" height="10" fill="${c.corridor}" fill-opacity="0.22" stroke="${c.corridorEdge}"/>`,
    label: 'Risk corridor, current solution',
  })
  if (earlier) rows.push({
    glyph: `<rect x="0" y="-5" width="18" height="10" fill="none" stroke="${c.earlier}" stroke-dasharray="5 4"/>`,
    label: 'Risk corridor, earlier solutions',
  })
  for (const k of ['sea', 'land', 'air'] as const) {
    if (!kinds.includes(k)) continue
    const g = k === 'sea'
      ? `<path d="M9 0h0" stroke="${c.points.sea}" stroke-width="4" stroke-linecap="round"/>`
      : k === 'land' ? `<rect x="6" y="-3" width="6" height="6" fill="${c.points.land}"/>` : `<circle cx="9" cy="0" r="3" fill="none" stroke="${c.points.air}"/>`
    rows.push({ glyph: g, label: POINT_LABELS[k] })
  }
  for (const key of rings) {
    const r = o.rings?.find(x => x.key === key)
    rows.push({
      glyph: `<path d="M0 0h18" stroke="${c.ring}" stroke-width="1.6" stroke-dasharray="${RING_DASH[key] ?? ''}"/>`,
      label: r ? `${r.label}: ${ringLabel(r).replace(' · ', ' within ')}` : key,
    })
  }
  for (const key of footprints ?? []) {
    const paint = c.footprint[footprintKind(key)]
    // Three swatches, weakest first; each stacks the layers the map stacks there.
    const swatches = [1, 2, 3].map((n, i) => paint.fills.slice(0, n)
      .map(([fill, op]) => `<rect x="${i * 8}" y="-5" width="7" height="10" fill="${fill}" fill-opacity="${op}"/>`).join('')).join('')
    const words = [0.1, 0.5, 0.9].map(p => FOOTPRINT_LEVEL_WORDS[p]).join(', ')
    rows.push({ glyph: `<g data-legend-footprint="${escapeXml(key)}">${swatches}</g>`, label: `${footprintName(key)}: chance ${words}` })
    rows.push({ glyph: `<path d="M0 0h22" stroke="${paint.line}" stroke-width="1.1"/>`, label: `${footprintName(key)}, middle case` })
  }
  for (const t of tones) rows.push({
    glyph: `<path d="${siteGlyph(t, 9, 0, 5)}" fill="${c.site[t]}" stroke="${c.siteEdge}"/>`,
    label: toneLabel(t),
  })
  const note = footprints
    ? (footprints.length ? `${footprintShadingText(footprints, o.impactPoints?.length ?? 0)} ${footprintLineText(o.ringBasis ?? null)}` : '')
    : rings.length ? ringBasisText(o.ringBasis ?? null) : ''
  const lineH = 16, width = 380
  const noteLines = wrap(note, 66)
  const height = 12 + rows.length * lineH + noteLines.length * 13 + 8
  const y0 = h - height - 12
  const parts = [`<g class="legend" transform="translate(12 ${y0})"><rect width="${width}" height="${height}" rx="6" fill="${c.legendBg}" fill-opacity="0.92" stroke="${c.borders}"/>`]
  rows.forEach((r, i) => parts.push(`<g transform="translate(10 ${14 + i * lineH})">${r.glyph}<text x="26" y="0" dominant-baseline="central" font-size="11" fill="${c.text}">${escapeXml(r.label)}</text></g>`))
  noteLines.forEach((l, i) => parts.push(`<text x="10" y="${14 + rows.length * lineH + i * 13}" dominant-baseline="central" font-size="10" fill="${c.text}">${escapeXml(l)}</text>`))
  parts.push('</g>')
  return parts.join('')
}

function wrap(s: string, n: number): string[] {
  const lines: string[] = []
  let line = ''
  for (const word of s.split(/\s+/).filter(Boolean)) {
    if ((line + ' ' + word).trim().length > n) { lines.push(line); line = word }
    else line = (line + ' ' + word).trim()
  }
  if (line) lines.push(line)
  return lines
}
