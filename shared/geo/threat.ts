/**
 * The threat in words for the brief, the rooms and the report: the tsunami band of each coastal site,
 * the energy by where it goes (air or surface) and the heat at the sites. Assessments stored by an
 * earlier model version lack the band and the air energy: these helpers then return what exists.
 */
import type { Assessment, Percentiles, SiteAssessment, TsunamiLawKey, TsunamiSourceLaw } from '../hazard/types'
import { formatPercent, medianRangeText, rangeText, sig } from './figures'

export const BAND_KEYS: readonly TsunamiLawKey[] = ['low', 'high']

/** One coastal site's tsunami: the laws mixed, and each law alone when the model gives the band. */
export interface CoastRow {
  siteId: string
  name: string
  distanceKm: Percentiles
  amplitudeM: Percentiles
  runUpM: Percentiles
  band: Record<TsunamiLawKey, { amplitudeM: Percentiles; runUpM: Percentiles }> | null
}

const wave = (s: SiteAssessment) =>
  Math.max(s.runUpM.p95, s.tsunamiAmplitudeM.p95, s.tsunamiBand?.high.runUpM.p95 ?? 0, s.tsunamiBand?.high.amplitudeM.p95 ?? 0)

/** Coastal sites nearest first; empty when no realisation sends a wave to any of them. */
export function coastRows(a: Assessment): CoastRow[] {
  const coastal = a.sites.filter(s => s.coastal !== false)
  if (!coastal.some(s => wave(s) > 0)) return []
  return coastal.map(s => ({
    siteId: s.siteId, name: s.name, distanceKm: s.distanceKm, amplitudeM: s.tsunamiAmplitudeM, runUpM: s.runUpM,
    band: s.tsunamiBand ?? null,
  })).sort((x, y) => x.distanceKm.p50 - y.distanceKm.p50)
}

/** The published source laws the band spans, low first (none for assessments without the band). */
export function sourceLaws(a: Assessment): TsunamiSourceLaw[] {
  return [...(a.tsunamiSourceLaws ?? [])].sort((x, y) => BAND_KEYS.indexOf(x.key) - BAND_KEYS.indexOf(y.key))
}

/** The largest ratio of the high law's median run-up to the low law's over the coastal sites (null without a band). */
export function bandFactor(a: Assessment): number | null {
  const ratios = coastRows(a).flatMap(r => (r.band && r.band.low.runUpM.p50 > 0 ? [r.band.high.runUpM.p50 / r.band.low.runUpM.p50] : []))
  return ratios.length ? Math.max(...ratios) : null
}

/** The plain-words warning that goes with the band. */
export function bandSpreadText(a: Assessment): string {
  const f = bandFactor(a)
  const here = f !== null && f >= 1.5 ? ` Here the high law's median run-up is up to ${sig(f)} times the low law's.` : ''
  return 'The spread between the published tsunami source laws is wide: each coastal site shows the low law and the high law '
    + `separately, and the mixed figures draw between them as model uncertainty.${here}`
}

/** "low law 0.8 m (5–95 %: 0.3–1.5) · high law 3.9 m (5–95 %: 1.2–7)". */
export function bandText(band: NonNullable<CoastRow['band']>, field: 'amplitudeM' | 'runUpM'): string {
  return `low law ${medianRangeText(band.low[field], 'm')} · high law ${medianRangeText(band.high[field], 'm')}`
}

/** One energy figure with what it is. */
export interface EnergyRow { key: 'entry' | 'air' | 'surface'; label: string; note: string; p: Percentiles }

const AIR_NOTE = 'Released in the airburst and along the entry path: blast and flash from the air.'
const SURFACE_NOTE = 'Delivered to the ground or the water: crater, shaking and tsunami.'

/** Entry energy, then the part deposited in the air (when the model gives it) and the part that reaches the surface. */
export function energyRows(a: Assessment): EnergyRow[] {
  return [
    { key: 'entry', label: 'Energy at entry', note: 'Kinetic energy as it enters the atmosphere (TNT equivalent).', p: a.energyMt },
    ...(a.airEnergyMt ? [{ key: 'air' as const, label: 'Deposited in the air', note: AIR_NOTE, p: a.airEnergyMt }] : []),
    { key: 'surface', label: 'Reaching the surface', note: SURFACE_NOTE, p: a.surfaceEnergyMt },
  ]
}

/** Where the heat comes from, given the share of airbursts. */
export function heatSourceText(a: Pick<Assessment, 'airburstProbability'>): string {
  const air = a.airburstProbability
  return air >= 1 ? 'the airburst flash' : air <= 0 ? 'the fireball' : 'the fireball or the airburst flash'
}

/** One site's heat: thermal exposure and the chance of each burn degree (conditional on impact). */
export interface HeatRow { siteId: string; name: string; thermalMJM2: Percentiles; burn1: number; burn2: number; burn3: number }

/** Sites that receive any heat, the most exposed first. */
export function heatRows(a: Assessment): HeatRow[] {
  return a.sites
    .filter(s => s.thermalMJM2.p95 > 0 || s.exceedance.burn1 > 0)
    .map(s => ({
      siteId: s.siteId, name: s.name, thermalMJM2: s.thermalMJM2,
      burn1: s.exceedance.burn1, burn2: s.exceedance.burn2, burn3: s.exceedance.burn3,
    }))
    .sort((x, y) => y.thermalMJM2.p50 - x.thermalMJM2.p50 || y.burn1 - x.burn1)
}

/** A sentence on the heat for briefs and the report. */
export function heatText(a: Assessment): string {
  const rows = heatRows(a)
  const from = heatSourceText(a)
  if (!rows.length) return `No site receives heat from ${from} in these realisations.`
  return `Heat from ${from} reaches ${rows.length === 1 ? 'one site' : `${rows.length} sites`}. Burn chances are conditional on impact.`
}

/** "15 m (11–19)": a median with its 5–95 % range in brackets, for table cells whose heading says so. */
export function compactText(p: Percentiles, unit: string): string {
  return `${sig(p.p50)} ${unit} (${rangeText(p, '')})`
}

/** A solution's hazard as text for the after-action report (the PDF and the printable page draw the same strings). */
export interface ThreatSummary {
  label: string
  modelVersion: string
  airburstText: string
  energies: Array<{ key: EnergyRow['key']; label: string; note: string; text: string }>
  laws: TsunamiSourceLaw[]
  bandNote: string
  coast: Array<{
    siteId: string
    name: string
    distanceText: string
    runUpText: string
    band: Record<TsunamiLawKey, { runUpText: string; amplitudeText: string }> | null
  }>
  heatSource: string
  heatText: string
  heat: Array<{ siteId: string; name: string; thermalText: string; burn1: string; burn2: string; burn3: string }>
}

/** The summary of one assessment for the report; without the band (older model versions) it says so. */
export function threatSummary(a: Assessment, label: string): ThreatSummary {
  const laws = sourceLaws(a)
  const m = (p: Percentiles) => compactText(p, 'm')
  const band = (b: CoastRow['band']) => b && {
    low: { runUpText: m(b.low.runUpM), amplitudeText: m(b.low.amplitudeM) },
    high: { runUpText: m(b.high.runUpM), amplitudeText: m(b.high.amplitudeM) },
  }
  return {
    label, modelVersion: a.modelVersion, airburstText: formatPercent(a.airburstProbability),
    energies: energyRows(a).map(e => ({ key: e.key, label: e.label, note: e.note, text: medianRangeText(e.p, 'Mt TNT') })),
    laws,
    bandNote: laws.length
      ? bandSpreadText(a)
      : `Computed by hazard model ${a.modelVersion}, which gives no tsunami band: the run-up mixes the source laws and is the only figure.`,
    coast: coastRows(a).map(r => ({
      siteId: r.siteId, name: r.name, distanceText: rangeText(r.distanceKm, 'km'), runUpText: m(r.runUpM), band: band(r.band),
    })),
    heatSource: heatSourceText(a),
    heatText: heatText(a),
    heat: heatRows(a).map(r => ({
      siteId: r.siteId, name: r.name, thermalText: compactText(r.thermalMJM2, 'MJ/m²'),
      burn1: formatPercent(r.burn1), burn2: formatPercent(r.burn2), burn3: formatPercent(r.burn3),
    })),
  }
}
