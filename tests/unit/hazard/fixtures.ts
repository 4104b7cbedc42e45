import { orbitSolutionSchema, siteSchema, type OrbitSolution, type OrbitSolutionInput, type Site } from '../../../shared/hazard/index'

/** An invented solution (fictional object) whose corridor runs onto the Atlantic coast of Portugal. */
export function demoSolution(over: Partial<OrbitSolutionInput> = {}): OrbitSolution {
  return orbitSolutionSchema.parse({
    epoch: '2031-05-01T00:00:00Z',
    impactTime: '2034-09-14T03:12:00Z',
    impactProbability: 0.08,
    magnitude: { H: 22.4, sigma: 0.3 },
    taxonomicClass: 'unknown',
    entrySpeedKmS: { mean: 17.5, sigma: 1.2 },
    corridor: { path: [[-22, 35.2], [-14, 37.4], [-6, 39.4]], halfWidthKm: 25, nominal: [-11.2, 38.2], alongTrackSigmaKm: 180 },
    waterDepthM: 4800,
    ...over,
  })
}

/** Invented site names on real Portuguese coastline positions. */
export function demoSites(): Site[] {
  const raw: Array<[string, number, number, number]> = [
    ['cabo-ardente', -9.49, 38.70, 210_000],
    ['porto-estreito', -9.14, 38.71, 1_100_000],
    ['praia-grande-norte', -9.36, 39.36, 48_000],
    ['foz-clara', -8.87, 40.15, 62_000],
    ['sines-velho', -8.87, 37.95, 14_000],
    ['faro-leste', -7.93, 37.01, 65_000],
  ]
  return raw.map(([id, lon, lat, population]) =>
    siteSchema.parse({ id, name: id, lon, lat, population, offshoreDepthM: 50, beachSlopeDeg: 1.5 }))
}
