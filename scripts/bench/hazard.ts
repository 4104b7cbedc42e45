/**
 * Benchmark of the hazard engine: realisations per second of assessSolution on an invented solution
 * (fictional object "2031 BW", impact corridor off the Atlantic coast of Portugal, 12 invented sites on
 * that real coastline). Run: node --import tsx scripts/bench/hazard.ts
 */
import { assessSolution, orbitSolutionSchema, siteSchema, type Site } from '../../shared/hazard/index'

const solution = orbitSolutionSchema.parse({
  epoch: '2031-05-01T00:00:00Z',
  impactTime: '2034-09-14T03:12:00Z',
  impactProbability: 0.08,
  magnitude: { H: 22.4, sigma: 0.3 },
  taxonomicClass: 'unknown',
  entrySpeedKmS: { mean: 17.5, sigma: 1.2 },
  corridor: {
    path: [[-22, 35.2], [-14, 37.4], [-6, 39.4]],
    halfWidthKm: 25,
    nominal: [-11.2, 38.2],
    alongTrackSigmaKm: 180,
  },
  waterDepthM: 4800,
})

const raw: Array<[string, string, number, number, number]> = [
  ['cabo-ardente', 'Cabo Ardente', -9.49, 38.70, 210_000],
  ['vila-serra', 'Vila da Serra', -9.47, 38.80, 95_000],
  ['porto-estreito', 'Porto Estreito', -9.14, 38.71, 1_100_000],
  ['praia-grande-norte', 'Praia Grande do Norte', -9.36, 39.36, 48_000],
  ['nazare-nova', 'Nazaré Nova', -9.08, 39.60, 31_000],
  ['foz-clara', 'Foz Clara', -8.87, 40.15, 62_000],
  ['ria-azul', 'Ria Azul', -8.75, 40.64, 80_000],
  ['douro-mar', 'Douro-Mar', -8.68, 41.16, 950_000],
  ['sines-velho', 'Sines-o-Velho', -8.87, 37.95, 14_000],
  ['ponta-sagre', 'Ponta Sagre', -8.94, 37.01, 6_000],
  ['lagoa-dourada', 'Lagoa Dourada', -8.67, 37.10, 31_000],
  ['faro-leste', 'Faro-Leste', -7.93, 37.01, 65_000],
]
const sites: Site[] = raw.map(([id, name, lon, lat, population]) => siteSchema.parse({ id, name, lon, lat, population, offshoreDepthM: 50, beachSlopeDeg: 1.5 }))

function time(samples: number, seed: number): number {
  const t = performance.now()
  assessSolution(solution, sites, { samples, seed })
  return performance.now() - t
}

const cold = time(20_000, 1)
console.log(`hazard bench: node ${process.version}, ${sites.length} sites`)
console.log(`first call (builds the land tiles of the corridor): ${cold.toFixed(1)} ms`)
for (let k = 0; k < 3; k++) time(20_000, 100 + k)
for (const samples of [20_000, 200_000]) {
  const runs = samples > 50_000 ? 5 : 20
  const ts: number[] = []
  for (let k = 0; k < runs; k++) ts.push(time(samples, 1000 + k))
  ts.sort((a, b) => a - b)
  const med = ts[Math.floor(ts.length / 2)]!
  console.log(`assessSolution ${samples.toLocaleString('en')} samples x ${sites.length} sites: median ${med.toFixed(1)} ms over ${runs} runs -> ${Math.round(samples / med * 1000).toLocaleString('en')} realisations/s`)
}
const a = assessSolution(solution, sites, { samples: 20_000, seed: 1 })
console.log(`one 20,000-sample 12-site assessment: ${time(20_000, 1).toFixed(1)} ms (target < 100 ms)`)
console.log(`check: diameter p50 ${a.diameterM.p50.toFixed(0)} m, energy p50 ${a.energyMt.p50.toFixed(1)} Mt, airburst ${(a.airburstProbability * 100).toFixed(1)} %, ocean ${(a.oceanImpactProbability * 100).toFixed(1)} %, Torino ${a.torino}, Palermo ${a.palermo.toFixed(2)}`)
