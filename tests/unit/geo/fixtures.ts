/** Corridors and sites shaped like the demo scenario (scenarios/demo-ocean-impact.yaml), and a hand-made assessment. */
import type { Assessment, Percentiles, SiteAssessment, ThresholdKey } from '../../../shared/hazard/types'
import { THRESHOLDS } from '../../../shared/hazard/types'
import type { SceneSite } from '../../../shared/geo'
import { orbitSolutionSchema, type LonLat, type OrbitSolution } from '../../../shared/hazard/schema'

/** The demo scenario's last solution as the engine takes it (scenarios/demo-ocean-impact.yaml): a 150 m stony body off the coast. */
export function demoLastSolution(): OrbitSolution {
  return orbitSolutionSchema.parse({
    epoch: '2031-05-01T00:00:00Z', impactTime: '2031-09-08T04:17:26Z', impactProbability: 1,
    magnitude: { H: 21.1, sigma: 0.08 }, albedo: { min: 0.23, max: 0.28 }, taxonomicClass: 'S', densityKgM3: { mean: 2500, sigma: 250 },
    entrySpeedKmS: { mean: 17.61, sigma: 0 }, entryAngleDeg: { mean: 37.6, sigma: 0 },
    corridor: {
      path: [[-11.5852, 39.2488], [-9.55, 39.95], [-7.6045, 40.6493]], halfWidthKm: 3.9, nominal: [-9.55, 39.95], alongTrackSigmaKm: 50.8,
    },
    waterDepthM: 450,
  })
}

/** A band across the Atlantic, 700 km half-width (the demo's first solution before it was computed from an encounter). */
export const WIDE = {
  path: [
    [-59.47, 7.75],
    [-51.99, 14.71],
    [-44.02, 21.42],
    [-35.3, 27.72],
    [-25.57, 33.41],
    [-14.59, 38.24],
    [-2.26, 41.92],
    [11.26, 44.13],
    [25.42, 44.67],
  ] as LonLat[],
  halfWidthKm: 700,
  nominal: [-25.573, 33.409] as LonLat,
  alongTrackSigmaKm: 2500,
}

/** A point some 50 km off the coast, 2 km half-width (the demo's last solution before it was computed from an encounter). */
export const NARROW = {
  path: [[-9.74, 39.89], [-9.55, 39.95], [-9.36, 40.01]] as LonLat[],
  halfWidthKm: 2,
  nominal: [-9.55, 39.95] as LonLat,
  alongTrackSigmaKm: 2.5,
}

export const SITES: SceneSite[] = [
  { id: 'porto-salgado', name: 'Porto Salgado', lon: -8.83, lat: 40.14, population: 61500, tone: 'high' },
  { id: 'ria-serena', name: 'Ria Serena', lon: -8.74, lat: 40.62, population: 78000, tone: 'moderate' },
  { id: 'montalvor', name: 'Montalvor', lon: -8.78, lat: 39.7, population: 126000, tone: 'inland' },
]

const p = (p5: number, p50: number, p95: number): Percentiles => ({ p5, p50, p95 })

function site(id: string, name: string, km: number): SiteAssessment {
  const exceedance = Object.fromEntries(THRESHOLDS.map(t => [t.key, 0.5])) as Record<ThresholdKey, number>
  return {
    siteId: id, name, population: 1000, coastal: true,
    distanceKm: p(km - 2, km, km + 2), overpressureKPa: p(5, 6, 7), windMS: p(10, 12, 14), thermalMJM2: p(0, 0, 0),
    seismicMagnitude: p(0, 0, 0), tsunamiAmplitudeM: p(5, 8, 11), tsunamiArrivalMin: p(8, 9, 10), tsunamiMainArrivalMin: p(10, 12, 14),
    runUpM: p(12, 16, 20), exceedance,
  }
}

/** A surface-impact assessment near the demo's last solution (figures rounded from an engine run). */
export function surfaceAssessment(): Assessment {
  const exposedPopulation = Object.fromEntries(THRESHOLDS.map(t => [t.key, 0])) as Record<ThresholdKey, number>
  return {
    modelVersion: 'test', options: { samples: 20000, seed: 1, strengthModel: 'density' }, impactProbability: 1,
    diameterM: p(150, 160, 170), massKg: p(4e9, 5e9, 6e9), energyMt: p(145, 193, 256), airburstProbability: 0,
    burstAltitudeKm: null, oceanImpactProbability: 1, tsunamiProbability: 1, surfaceEnergyMt: p(26, 63, 119),
    waterCavityDiameterM: p(2300, 2855, 3342), sites: [site('porto-salgado', 'Porto Salgado', 65)], exposedPopulation,
    torino: 9, palermo: 5.05, warnings: [], impactPoints: [[-9.55, 39.95, 1], [-9.56, 39.94, 1], [120, -30, 0]],
  }
}
