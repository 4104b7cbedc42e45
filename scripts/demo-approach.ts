// Prints the `solutions:` section of scenarios/demo-approach.yaml: three solutions computed from one encounter.
// Run: node --import tsx scripts/demo-approach.ts. Paste the output over the section (the rest of the file is by hand).
import { findBPlanePoint, greenwichSiderealDeg } from '../shared/encounter'
import { applyEncounter } from '../shared/scenario/encounter'
import { stringifyScenario } from '../shared/scenario'
import type { Scenario, SolutionEntry } from '../shared/scenario'

const timeUtc = '2034-03-19T22:47:00Z'
const target: [number, number] = [-10.9, 53.3]
const vInfKmS = 12
const radiant = { raDeg: Number(((greenwichSiderealDeg(timeUtc) + target[0] + 35 + 720) % 360).toFixed(2)), decDeg: 43 }
const found = findBPlanePoint({ vInfKmS, radiant, timeUtc, target })
if (!found) throw new Error('unreachable')
const nominal = { xiKm: Number(found.xiKm.toFixed(3)), zetaKm: Number(found.zetaKm.toFixed(3)) }

const series = [
  { key: 'p1-discovery', label: 'Solution 1 — discovery arc', releaseAt: '2034-03-04T10:00:00Z', along: 60_000, across: 3000,
    magnitude: { H: 22.4, sigma: 0.5 } },
  { key: 'p2-refined', label: 'Solution 2 — two-week arc', releaseAt: '2034-03-11T10:00:00Z', along: 6000, across: 400,
    magnitude: { H: 22.5, sigma: 0.3 } },
  { key: 'p3-radar', label: 'Solution 3 — radar ranging; spectrum S-type', releaseAt: '2034-03-17T10:00:00Z', along: 250, across: 25,
    magnitude: { H: 22.5, sigma: 0.1 } },
]

const solutions = series.map((s, i): SolutionEntry => applyEncounter({
  key: s.key, label: s.label, releaseAt: s.releaseAt,
  solution: {
    epoch: new Date(Date.parse(s.releaseAt) - 6 * 3600_000).toISOString().replace('.000Z', 'Z'),
    impactTime: timeUtc, impactProbability: 0, magnitude: s.magnitude,
    ...(i === 2
      ? { albedo: { min: 0.2, max: 0.3 }, taxonomicClass: 'S' as const, densityKgM3: { mean: 2600, sigma: 400 } }
      : { taxonomicClass: 'unknown' as const }),
    entrySpeedKmS: { mean: 20, sigma: 0 },
    corridor: { path: [[0, 0], [1, 1]], halfWidthKm: 0, nominal: [0, 0], alongTrackSigmaKm: 0 },
    waterDepthM: 120,
  },
  encounter: { vInfKmS, radiant, timeUtc, nominal, sigmaAlongKm: s.along, sigmaAcrossKm: s.across, lineAngleDeg: 25, seed: i + 1 },
}))
for (const { key, solution: { impactProbability, corridor } } of solutions) {
  console.error(key, impactProbability, corridor.halfWidthKm, corridor.alongTrackSigmaKm)
}
console.log(stringifyScenario({ solutions } as unknown as Scenario).replace(/^#.*\n/, ''))
