/**
 * Map colours for the SVG renderer, taken from Brinkwater's palette (tailwind.config.ts): water in tide,
 * land in abyss, the corridor in flare, blast in coral. Colour is always paired with a shape or a dash.
 */
import { THRESHOLDS } from '../hazard/types'
import type { RunUpClass } from './overlays'
import type { PointKind } from './scene'
import type { ZoneKind } from './zones'

export interface MapPalette {
  sea: string
  land: string
  coast: string
  borders: string
  graticule: string
  corridor: string
  corridorEdge: string
  earlier: string
  text: string
  halo: string
  points: Record<PointKind, string>
  ring: string
  /**
   * Footprint shading by threshold kind (blast in coral, heat in flare): colour and opacity of the 1 in 10, even-odds
   * and 9 in 10 areas, drawn on top of each other (so the inner areas come out darker), and the median-case line.
   */
  footprint: Record<'overpressure' | 'thermal', { fills: Array<[string, number]>; line: string }>
  site: Record<RunUpClass, string>
  siteEdge: string
  marking: string
  markingText: string
  legendBg: string
}

export const MAP_PALETTES: Record<'light' | 'dark', MapPalette> = {
  light: {
    sea: '#d6f1fb', land: '#ebe6d9', coast: '#526c84', borders: '#9fb1c1', graticule: '#74cdee',
    corridor: '#f07b10', corridorEdge: '#ab420b', earlier: '#526c84', text: '#17202c', halo: '#ffffff',
    points: { sea: '#0d5c81', land: '#c22f45', air: '#17202c' },
    ring: '#9f2339',
    footprint: {
      overpressure: { fills: [['#f2707a', 0.22], ['#e0475a', 0.3], ['#9f2339', 0.36]], line: '#9f2339' },
      thermal: { fills: [['#ffbd5e', 0.3], ['#f07b10', 0.3], ['#ab420b', 0.36]], line: '#8a3510' },
    },
    site: { high: '#c22f45', moderate: '#fd9a2e', low: '#74cdee', none: '#ffffff', inland: '#7189a0', offshore: '#b7c6d3' },
    siteEdge: '#0d131b',
    marking: '#fd9a2e', markingText: '#0d131b', legendBg: '#ffffff',
  },
  dark: {
    sea: '#0b293c', land: '#233041', coast: '#7189a0', borders: '#526c84', graticule: '#13405a',
    corridor: '#fd9a2e', corridorEdge: '#ffbd5e', earlier: '#9fb1c1', text: '#f3f6f8', halo: '#0d131b',
    points: { sea: '#74cdee', land: '#f2707a', air: '#f3f6f8' },
    ring: '#f2707a',
    footprint: {
      overpressure: { fills: [['#9f2339', 0.32], ['#c22f45', 0.25], ['#e0475a', 0.28]], line: '#f2707a' },
      thermal: { fills: [['#ab420b', 0.32], ['#d25d08', 0.25], ['#f07b10', 0.28]], line: '#ffbd5e' },
    },
    site: { high: '#e0475a', moderate: '#fd9a2e', low: '#74cdee', none: '#0d131b', inland: '#9fb1c1', offshore: '#526c84' },
    siteEdge: '#f3f6f8',
    marking: '#fd9a2e', markingText: '#0d131b', legendBg: '#17202c',
  },
}

/** The kind of a footprint threshold, for its colours: blast (overpressure) or heat. */
export function footprintKind(key: string): 'overpressure' | 'thermal' {
  return THRESHOLDS.find(t => t.key === key)?.kind === 'thermal' ? 'thermal' : 'overpressure'
}

/**
 * The same footprint colours as Tailwind classes for the Vue map and its legend (light, then dark): the fill of the
 * 1 in 10, even-odds and 9 in 10 areas (stacked), the median-case line and the label.
 */
export const FOOTPRINT_CLASSES: Record<'overpressure' | 'thermal', { fills: string[]; line: string; text: string }> = {
  overpressure: {
    fills: ['fill-coral-400/[0.22] dark:fill-coral-700/[0.32]', 'fill-coral-500/30 dark:fill-coral-600/25', 'fill-coral-700/[0.36] dark:fill-coral-500/[0.28]'],
    line: 'stroke-coral-700 dark:stroke-coral-400',
    text: 'fill-coral-700 dark:fill-coral-400',
  },
  thermal: {
    fills: ['fill-flare-300/30 dark:fill-flare-700/[0.32]', 'fill-flare-500/30 dark:fill-flare-600/25', 'fill-flare-700/[0.36] dark:fill-flare-500/[0.28]'],
    line: 'stroke-flare-800 dark:stroke-flare-300',
    text: 'fill-flare-800 dark:fill-flare-300',
  },
}

/** Dash pattern of each blast ring, outermost (least damage) finest. */
export const RING_DASH: Record<string, string> = {
  windows: '2 4',
  houseDamage: '6 4',
  houseCollapse: '8 5',
  multistoreyCracked: '10 4',
  multistoreyCollapse: '',
  bridgeCollapse: '',
  steelFrameCollapse: '',
}

/**
 * The marker of a site: triangle for run-up of 3 m or more, diamond for 1–3 m, circle below 1 m,
 * hollow circle for none, square inland, a cross for an offshore installation. `r` is the half-size in pixels.
 */
export function siteGlyph(tone: RunUpClass, x: number, y: number, r: number): string {
  const f = (v: number) => Math.round(v * 10) / 10
  switch (tone) {
    case 'high': return `M${f(x)} ${f(y - r * 1.25)}L${f(x + r * 1.15)} ${f(y + r * 0.85)}L${f(x - r * 1.15)} ${f(y + r * 0.85)}Z`
    case 'moderate': return `M${f(x)} ${f(y - r * 1.2)}L${f(x + r * 1.2)} ${f(y)}L${f(x)} ${f(y + r * 1.2)}L${f(x - r * 1.2)} ${f(y)}Z`
    case 'offshore': {
      const a = r * 1.1, b = r * 0.35
      return `M${f(x - b)} ${f(y - a)}h${f(2 * b)}v${f(a - b)}h${f(a - b)}v${f(2 * b)}h${f(b - a)}v${f(a - b)}h${f(-2 * b)}v${f(b - a)}h${f(b - a)}v${f(-2 * b)}h${f(a - b)}Z`
    }
    case 'inland': return `M${f(x - r * 0.85)} ${f(y - r * 0.85)}h${f(r * 1.7)}v${f(r * 1.7)}h${f(-r * 1.7)}Z`
    default: return `M${f(x - r)} ${f(y)}a${r} ${r} 0 1 0 ${f(2 * r)} 0a${r} ${r} 0 1 0 ${f(-2 * r)} 0Z`
  }
}

/** Chart colours (ECharts options) from the same palette, per theme. */
export interface ChartPalette {
  text: string
  muted: string
  axis: string
  split: string
  primary: string
  secondary: string
  danger: string
  band: string
  background: string
}

export const CHART_PALETTES: Record<'light' | 'dark', ChartPalette> = {
  light: {
    text: '#233041',
    muted: '#526c84',
    axis: '#9fb1c1',
    split: '#e3e9ee',
    primary: '#0b73a0',
    secondary: '#d25d08',
    danger: '#c22f45',
    band: 'rgba(19, 145, 195, 0.2)',
    background: '#ffffff',
  },
  dark: {
    text: '#e3e9ee',
    muted: '#9fb1c1',
    axis: '#526c84',
    split: '#233041',
    primary: '#36afdf',
    secondary: '#fd9a2e',
    danger: '#f2707a',
    band: 'rgba(54, 175, 223, 0.25)',
    background: '#17202c',
  },
}

/**
 * Protective-action zones by kind (Tailwind classes for the map and its legend): evacuate in coral with a solid edge,
 * shelter in place in tide with a long dash, keep out in the ink colour with a short dash; each labelled by name.
 */
export const ZONE_CLASSES: Record<ZoneKind, { path: string; dash?: string; legend: string }> = {
  evacuate: { path: 'fill-coral-500/15 stroke-coral-700 dark:stroke-coral-400', legend: 'Evacuation zone' },
  shelter: { path: 'fill-tide-500/15 stroke-tide-800 dark:stroke-tide-300', dash: '7 3', legend: 'Shelter-in-place zone' },
  exclusion: { path: 'fill-abyss-900/10 stroke-abyss-900 dark:fill-abyss-50/10 dark:stroke-abyss-50', dash: '2 3', legend: 'Keep-out zone' },
}
