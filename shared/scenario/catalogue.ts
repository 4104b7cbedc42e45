/**
 * The catalogue of hazard fields that inject text may quote, generated from the shape of the
 * hazard engine's `Assessment` (shared/hazard/types.ts): the `Record<…>` tables below must name
 * every percentile and scalar key of `Assessment` and `SiteAssessment`, so a new figure in the
 * engine fails to compile here until it has a label and a unit.
 */
import { THRESHOLDS } from '../hazard/types'
import type { Assessment, Percentiles, SiteAssessment } from '../hazard/types'

export type Dimension
  = | 'energy' | 'length' | 'mass' | 'pressure' | 'speed' | 'thermal' | 'time'
    | 'magnitude' | 'probability' | 'people' | 'torino' | 'palermo' | 'text'

/** Units a figure may be shown in (after `|`), with their size in a common base per dimension. */
export const UNITS: Record<Dimension, Record<string, number>> = {
  energy: { Mt: 1, kt: 1e-3 },
  length: { m: 1, km: 1000 },
  mass: { kg: 1, t: 1000 },
  pressure: { kPa: 1, psi: 6.894757 },
  speed: { 'm/s': 1, 'km/h': 1 / 3.6 },
  thermal: { 'MJ/m2': 1 },
  time: { min: 1, h: 60 },
  probability: { '%': 1, 'odds': 1 },
  people: { people: 1 },
  magnitude: {},
  torino: {},
  palermo: {},
  text: {},
}

/** How a unit is written in rendered text. */
export const UNIT_DISPLAY: Record<string, string> = { 'MJ/m2': 'MJ/m²' }

/** How a field renders: a distribution in full or in part, or a single figure. */
export type FieldShape = 'distribution' | 'percentile' | 'range' | 'probability' | 'count' | 'scale' | 'text'

/** One entry of the catalogue. */
export interface HazardFieldSpec {
  /** The template path, with `<site>` standing for a site id: `site.<site>.runUpM.p95`. */
  path: string
  label: string
  group: 'impactor' | 'risk' | 'exposure' | 'site'
  shape: FieldShape
  dimension: Dimension
  /** Unit of the figure as rendered by default ('' when it has none). */
  unit: string
  /** Units accepted after `|` (the default unit included). */
  units: string[]
  /** Text shown when the engine has no such figure (e.g. no airburst among the samples). */
  whenMissing?: string
}

type PercentileKey<T> = { [K in keyof T]-?: NonNullable<T[K]> extends Percentiles ? K : never }[keyof T]
type NumberKey<T> = { [K in keyof T]-?: T[K] extends number ? K : never }[keyof T]

interface Meta { label: string; dimension: Dimension; unit: string; whenMissing?: string }

const IMPACTOR: Record<PercentileKey<Assessment>, Meta> = {
  diameterM: { label: 'Diameter', dimension: 'length', unit: 'm' },
  massKg: { label: 'Mass', dimension: 'mass', unit: 'kg' },
  energyMt: { label: 'Energy at entry (TNT equivalent)', dimension: 'energy', unit: 'Mt' },
  burstAltitudeKm: { label: 'Airburst altitude', dimension: 'length', unit: 'km', whenMissing: 'n/a (no airburst among the samples)' },
  surfaceEnergyMt: { label: 'Energy reaching the surface', dimension: 'energy', unit: 'Mt' },
  airEnergyMt: { label: 'Energy deposited in the air', dimension: 'energy', unit: 'Mt', whenMissing: 'n/a (model version without this figure)' },
  waterCavityDiameterM: { label: 'Transient cavity in the water', dimension: 'length', unit: 'm', whenMissing: 'n/a (no surface impact at sea among the samples)' },
}

const SCALARS: Record<NumberKey<Assessment>, Meta> = {
  impactProbability: { label: 'Impact probability', dimension: 'probability', unit: '%' },
  airburstProbability: { label: 'Probability of an airburst (given impact)', dimension: 'probability', unit: '%' },
  oceanImpactProbability: { label: 'Probability that it strikes the sea (given impact)', dimension: 'probability', unit: '%' },
  tsunamiProbability: {
    label: 'Probability of a tsunami, a wave of 1 m or more at its source (given impact)', dimension: 'probability', unit: '%',
  },
  torino: { label: 'Torino scale', dimension: 'torino', unit: '' },
  palermo: { label: 'Palermo scale', dimension: 'palermo', unit: '' },
}

const SITE_DISTRIBUTIONS: Record<PercentileKey<SiteAssessment>, Meta> = {
  distanceKm: { label: 'Distance from the impact point', dimension: 'length', unit: 'km' },
  overpressureKPa: { label: 'Peak blast overpressure', dimension: 'pressure', unit: 'kPa' },
  windMS: { label: 'Peak blast wind', dimension: 'speed', unit: 'm/s' },
  thermalMJM2: { label: 'Thermal exposure (fireball or airburst flash)', dimension: 'thermal', unit: 'MJ/m2' },
  seismicMagnitude: { label: 'Effective seismic magnitude', dimension: 'magnitude', unit: '' },
  tsunamiAmplitudeM: { label: 'Tsunami amplitude offshore (indicative)', dimension: 'length', unit: 'm' },
  tsunamiArrivalMin: { label: 'First tsunami arrival after impact (larger waves follow)', dimension: 'time', unit: 'min' },
  tsunamiMainArrivalMin: { label: 'Arrival of the main impact wave after impact', dimension: 'time', unit: 'min' },
  runUpM: { label: 'Tsunami run-up (indicative)', dimension: 'length', unit: 'm' },
}

/** The tsunami under each published source law alone (the band the literature spans; hazard engine 2.0). */
const BAND_LENGTH = { dimension: 'length', unit: 'm', whenMissing: 'n/a (model version without the tsunami band)' } as const
const SITE_BAND: Record<string, Meta> = {
  'tsunamiBand.low.amplitudeM': { label: 'Tsunami amplitude offshore, low source law (rim wave)', ...BAND_LENGTH },
  'tsunamiBand.low.runUpM': { label: 'Tsunami run-up, low source law (rim wave)', ...BAND_LENGTH },
  'tsunamiBand.high.amplitudeM': { label: 'Tsunami amplitude offshore, high source law (cavity-depth wave)', ...BAND_LENGTH },
  'tsunamiBand.high.runUpM': { label: 'Tsunami run-up, high source law (cavity-depth wave)', ...BAND_LENGTH },
}

const SITE_SCALARS: Record<NumberKey<SiteAssessment> | 'name', Meta> = {
  population: { label: 'Population', dimension: 'people', unit: 'people' },
  name: { label: 'Name', dimension: 'text', unit: '' },
}

const PERCENTILE_VARIANTS = [
  { suffix: '', shape: 'distribution', label: 'median with 5–95 % range' },
  { suffix: '.p5', shape: 'percentile', label: '5th percentile' },
  { suffix: '.p50', shape: 'percentile', label: 'median' },
  { suffix: '.p95', shape: 'percentile', label: '95th percentile' },
  { suffix: '.range', shape: 'range', label: '5–95 % range' },
] as const

function spec(path: string, group: HazardFieldSpec['group'], shape: FieldShape, meta: Meta): HazardFieldSpec {
  const entry: HazardFieldSpec = {
    path, label: meta.label, group, shape, dimension: meta.dimension, unit: meta.unit,
    units: Object.keys(UNITS[meta.dimension]),
  }
  if (meta.whenMissing) entry.whenMissing = meta.whenMissing
  return entry
}

function distributions(prefix: string, group: HazardFieldSpec['group'], table: Record<string, Meta>): HazardFieldSpec[] {
  return Object.entries(table).flatMap(([key, meta]) => PERCENTILE_VARIANTS.map(v =>
    spec(`${prefix}${key}${v.suffix}`, group, v.shape, { ...meta, label: `${meta.label}, ${v.label}` })))
}

function scalars(prefix: string, group: HazardFieldSpec['group'], table: Record<string, Meta>): HazardFieldSpec[] {
  return Object.entries(table).map(([key, meta]) => {
    const shape: FieldShape = meta.dimension === 'probability'
      ? 'probability'
      : meta.dimension === 'people' ? 'count' : meta.dimension === 'text' ? 'text' : 'scale'
    return spec(`${prefix}${key}`, group, shape, meta)
  })
}

/** Every hazard field an inject body may quote, in catalogue order (for pickers and docs). */
export const HAZARD_FIELDS: readonly HazardFieldSpec[] = Object.freeze([
  ...scalars('', 'risk', SCALARS),
  ...distributions('', 'impactor', IMPACTOR),
  ...THRESHOLDS.map(t => spec(`exposedPopulation.${t.key}`, 'exposure', 'count',
    { label: `Expected people exposed, given impact: ${t.label.toLowerCase()}`, dimension: 'people', unit: 'people' })),
  ...scalars('site.<site>.', 'site', SITE_SCALARS),
  ...distributions('site.<site>.', 'site', SITE_DISTRIBUTIONS),
  ...distributions('site.<site>.', 'site', SITE_BAND),
  ...THRESHOLDS.map(t => spec(`site.<site>.exceedance.${t.key}`, 'site', 'probability',
    { label: `Probability at the site, given impact: ${t.label.toLowerCase()}`, dimension: 'probability', unit: '%' })),
])

/** The catalogue by template path. */
export const FIELD_BY_PATH: ReadonlyMap<string, HazardFieldSpec> = new Map(HAZARD_FIELDS.map(f => [f.path, f]))

/** A figure as read from an assessment: a distribution, a number, a name, or nothing. */
export type FieldValue = Percentiles | number | string | null | undefined

/** Reads the raw figure behind a field path (`<site>` already replaced by `siteId`). */
export function readField(a: Assessment, spec: HazardFieldSpec, siteId?: string): FieldValue {
  const parts = spec.path.split('.')
  const variant = parts.at(-1)
  const keyParts = variant === 'p5' || variant === 'p50' || variant === 'p95' || variant === 'range' ? parts.slice(0, -1) : parts
  let node: unknown = a
  if (keyParts[0] === 'site') {
    node = a.sites.find(s => s.siteId === siteId)
    keyParts.splice(0, 2)
  }
  for (const key of keyParts) {
    if (node === null || typeof node !== 'object') return undefined
    node = (node as Record<string, unknown>)[key]
  }
  if (typeof node === 'number' || typeof node === 'string' || node === null || node === undefined) return node
  return node as Percentiles
}
