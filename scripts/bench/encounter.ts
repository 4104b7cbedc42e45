/**
 * Benchmark of the encounter engine: one solutionFromEncounter of 20 000 b-plane samples (target < 20 ms) for
 * three encounters (a broad cloud across the Earth, a narrow line of variations, a slow grazing case), and the
 * rate of single entryFromBPlane and findBPlanePoint calls. Run: node --import tsx scripts/bench/encounter.ts
 */
import { solutionFromEncounter, entryFromBPlane, findBPlanePoint, captureRadiusKm } from '../../shared/encounter/index'
import type { EncounterInput } from '../../shared/encounter/index'

const T = '2034-09-14T03:12:00Z'
const cases: Array<[string, EncounterInput]> = [
  ['broad cloud', {
    vInfKmS: 17, radiant: { raDeg: 300, decDeg: 35 }, timeUtc: T, nominal: { xiKm: 1500, zetaKm: -800 },
    sigmaAlongKm: 6000, sigmaAcrossKm: 3000, lineAngleDeg: 20,
  }],
  ['line of variations', {
    vInfKmS: 12, radiant: { raDeg: 45, decDeg: -10 }, timeUtc: T, nominal: { xiKm: 3000, zetaKm: 2000 },
    sigmaAlongKm: 8000, sigmaAcrossKm: 15, lineAngleDeg: 120,
  }],
  ['slow, grazing', {
    vInfKmS: 3, radiant: { raDeg: 180, decDeg: 60 }, timeUtc: T, nominal: { xiKm: captureRadiusKm(3) * 0.95, zetaKm: 0 },
    sigmaAlongKm: 2000, sigmaAcrossKm: 500, lineAngleDeg: 80,
  }],
]
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

console.log(`encounter bench: node ${process.version}`)
for (const [name, input] of cases) {
  for (let k = 0; k < 5; k++) solutionFromEncounter(input, { samples: 20_000, seed: 100 + k }) // warm the JIT
  const ts: number[] = []
  let last = solutionFromEncounter(input, { samples: 20_000, seed: 1 })
  for (let k = 0; k < 20; k++) {
    const t = performance.now()
    last = solutionFromEncounter(input, { samples: 20_000, seed: k + 1 })
    ts.push(performance.now() - t)
  }
  const c = last.corridor
  console.log(`solutionFromEncounter 20,000 samples, ${name}: median ${median(ts).toFixed(2)} ms, max ${Math.max(...ts).toFixed(2)} ms `
    + '(target < 20 ms)')
  console.log(`  check: P ${last.impactProbability.toFixed(4)}, hits ${last.encounter.hits}, angle ${last.entryAngleDeg.mean.toFixed(1)}°`
    + ` ± ${last.entryAngleDeg.sigma.toFixed(1)}, speed ${last.entrySpeedKmS.mean.toFixed(2)} km/s, corridor `
    + (c ? `${c.path.length} points, half-width ${c.halfWidthKm.toFixed(0)} km, along σ ${c.alongTrackSigmaKm.toFixed(0)} km` : 'none')
    + (last.warnings.length ? `, warnings ${last.warnings.map(w => w.code).join(', ')}` : ''))
}

const base = cases[0]![1]
const n = 20_000
let t = performance.now()
let sink = 0
for (let k = 0; k < n; k++) sink += entryFromBPlane({ ...base, xiKm: (k % 200) * 30, zetaKm: -3000 + (k % 97) * 50 }).lat ?? 0
const entryUs = (performance.now() - t) * 1000 / n
t = performance.now()
for (let k = 0; k < 2000; k++) sink += findBPlanePoint({ ...base, target: [-20 + (k % 40), 20 + (k % 30)] })?.xiKm ?? 0
const findUs = (performance.now() - t) * 1000 / 2000
console.log(`entryFromBPlane: ${entryUs.toFixed(2)} µs per call; findBPlanePoint: ${findUs.toFixed(2)} µs per call`
  + ` (checksum ${sink.toFixed(0)})`)
