import { escapeXml } from '#shared/geo'
import { pdfSafe } from '#shared/review/pdftext'

export interface ThreatPoint { label: string; impactProbability: number; torino: number }

/**
 * A bar chart of the impact probability of each published solution on a log scale (0.01 % to 100 %),
 * with the Torino rating over each bar: the threat as it evolved, for the report (SVG string).
 */
export function threatChartSvg(points: readonly ThreatPoint[], opts: { width?: number; height?: number; font?: string } = {}): string {
  const w = opts.width ?? 520, h = opts.height ?? 200
  const left = 52, right = 10, top = 34, bottom = 34
  const plotW = w - left - right, plotH = h - top - bottom
  const decades = [-4, -3, -2, -1, 0]
  const y = (p: number) => {
    const l = Math.log10(Math.min(1, Math.max(1e-4, p)))
    return top + plotH * (1 - (l + 4) / 4)
  }
  const font = opts.font ?? 'Plex'
  const out: string[] = [`<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}" font-family="${font}">`]
  out.push(`<text x="${left}" y="12" font-size="9" fill="#526c84">Impact probability of each published solution (log scale); Torino rating above each bar</text>`)
  for (const d of decades) {
    const yy = y(10 ** d)
    out.push(`<line x1="${left}" x2="${w - right}" y1="${yy}" y2="${yy}" stroke="#c6d2dc" stroke-width="0.6"/>`)
    out.push(`<text x="${left - 4}" y="${yy + 3}" font-size="8" text-anchor="end" fill="#526c84">${escapeXml(`${10 ** (d + 2) >= 1 ? 10 ** (d + 2) : (10 ** (d + 2)).toFixed(-d - 2)} %`)}</text>`)
  }
  const n = Math.max(1, points.length)
  const slot = plotW / n
  const bar = Math.min(36, slot * 0.6)
  points.forEach((p, i) => {
    const x = left + slot * i + (slot - bar) / 2
    const yy = y(p.impactProbability)
    out.push(`<rect x="${x.toFixed(1)}" y="${yy.toFixed(1)}" width="${bar.toFixed(1)}" height="${(top + plotH - yy).toFixed(1)}" fill="${i === points.length - 1 ? '#d25d08' : '#1391c3'}"/>`)
    out.push(`<text x="${(x + bar / 2).toFixed(1)}" y="${(yy - 3).toFixed(1)}" font-size="8" text-anchor="middle" fill="#17202c">T${p.torino}</text>`)
    out.push(`<text x="${(x + bar / 2).toFixed(1)}" y="${top + plotH + 12}" font-size="8" text-anchor="middle" fill="#17202c">${escapeXml(pdfSafe(p.label.length > 16 ? `${p.label.slice(0, 15)}…` : p.label))}</text>`)
  })
  out.push(`<line x1="${left}" x2="${w - right}" y1="${top + plotH}" y2="${top + plotH}" stroke="#526c84" stroke-width="0.8"/>`)
  out.push('</svg>')
  return out.join('')
}
