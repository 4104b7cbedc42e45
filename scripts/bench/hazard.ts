/**
 * Benchmark of the hazard engine on the demo scenario's own orbit solutions and its 12 sites:
 * realisations per second of assessSolution at 20 000 and 200 000 samples, the time of one
 * 20 000-sample assessment, and the draw from the corridor band against the draw from the solutions' encounters
 * (`sampling: 'encounter'`; target: within 2× the band). Run: npm run bench (or node --import tsx scripts/bench/hazard.ts).
 */
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { assessSolution } from '../../shared/hazard/index'
import { drawSamples, allocSamples } from '../../shared/hazard/sample'
import { MIN_ENCOUNTER_HIT_SHARE } from '../../shared/encounter/index'
import { parseScenarioYaml } from '../../shared/scenario/index'
import { engineSolution } from '../../shared/scenario/encounter'
import { zoneFigures, type ZoneShape } from '../../shared/geo/zones'
import { destination } from '../../shared/geo/sphere'

const file = resolve(import.meta.dirname, '../../scenarios/demo-ocean-impact.yaml')
const parsed = parseScenarioYaml(readFileSync(file, 'utf8'))
if (!parsed.ok) throw new Error(`demo scenario invalid: ${JSON.stringify(parsed.errors[0])}`)
const { solutions, sites } = parsed.scenario

function time(solution: (typeof solutions)[number]['solution'], samples: number, seed: number): number {
  const t = performance.now()
  assessSolution(solution, sites, { samples, seed })
  return performance.now() - t
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

console.log(`hazard bench: node ${process.version}, demo scenario "${parsed.scenario.key}", ${solutions.length} solutions, ${sites.length} sites`)
console.log(`first call (builds the land tiles of the corridor): ${time(solutions[0]!.solution, 20_000, 1).toFixed(1)} ms`)
for (const s of solutions) time(s.solution, 20_000, 7) // warm every corridor's land tiles and the JIT

for (const samples of [20_000, 200_000]) {
  const runs = samples > 50_000 ? 2 : 10
  const per: string[] = []
  let total = 0
  for (const s of solutions) {
    const ts: number[] = []
    for (let k = 0; k < runs; k++) ts.push(time(s.solution, samples, 1000 + k))
    const med = median(ts)
    total += med
    per.push(`${s.key} ${Math.round(samples / med * 1000).toLocaleString('en')}/s`)
  }
  const rate = Math.round(samples * solutions.length / total * 1000)
  console.log(`assessSolution ${samples.toLocaleString('en')} samples x ${sites.length} sites: ${rate.toLocaleString('en')} realisations/s over the ${solutions.length} solutions (target >= 500,000)`)
  console.log(`  per solution: ${per.join(', ')}`)
}
const last = solutions.at(-1)!.solution
const one = median(Array.from({ length: 10 }, (_, k) => time(last, 20_000, k + 1)))
console.log(`one 20,000-sample ${sites.length}-site assessment (final solution): median ${one.toFixed(1)} ms (target < 100 ms)`)
const a = assessSolution(last, sites, { samples: 20_000, seed: 1 })
console.log(`check: diameter p50 ${a.diameterM.p50.toFixed(0)} m, energy p50 ${a.energyMt.p50.toFixed(1)} Mt, airburst ${(a.airburstProbability * 100).toFixed(1)} %, ocean ${(a.oceanImpactProbability * 100).toFixed(1)} %, Torino ${a.torino}, Palermo ${a.palermo.toFixed(2)}`)

// The draw alone (drawSamples: size, entry and the per-realisation physics, no sites) and the whole assessment, from the
// corridor band and from the encounter, for each solution whose encounter hits often enough to draw from.
const drawable = solutions.filter(e => e.encounter && e.solution.impactProbability >= MIN_ENCOUNTER_HIT_SHARE)
const S = allocSamples(20_000)
const drawMs = (solution: (typeof solutions)[number]['solution'], seed: number) => {
  const t = performance.now()
  drawSamples(solution, 20_000, seed, 'density', S)
  return performance.now() - t
}
let band = 0, enc = 0, bandAll = 0, encAll = 0
const per: string[] = []
for (const e of drawable) {
  const corridor = e.solution, joint = engineSolution({ ...e, solution: { ...e.solution, sampling: 'encounter' } })
  for (let k = 0; k < 3; k++) { drawMs(corridor, 50 + k); drawMs(joint, 50 + k) } // warm
  const b = median(Array.from({ length: 15 }, (_, k) => drawMs(corridor, k + 1)))
  const j = median(Array.from({ length: 15 }, (_, k) => drawMs(joint, k + 1)))
  band += b; enc += j
  bandAll += median(Array.from({ length: 7 }, (_, k) => time(corridor, 20_000, k + 1)))
  encAll += median(Array.from({ length: 7 }, (_, k) => time(joint, 20_000, k + 1)))
  per.push(`${e.key} ${b.toFixed(1)} / ${j.toFixed(1)} ms`)
}
console.log(`drawSamples 20,000 realisations, corridor band / encounter (median, summed over ${drawable.length} solutions): `
  + `${band.toFixed(1)} / ${enc.toFixed(1)} ms = ${(enc / band).toFixed(2)}× (target <= 2×)`)
console.log(`  per solution: ${per.join(', ')}`)
console.log(`assessSolution 20,000 samples x ${sites.length} sites, corridor band / encounter: ${bandAll.toFixed(1)} / ${encAll.toFixed(1)} ms `
  + `= ${(encAll / bandAll).toFixed(2)}×`)

// A protective-action zone's figures against the final assessment (what a zone drawn in a room costs the server and
// the page): a circle and a 60-corner polygon, 2,000 thinned realisations with their reach.
{
  const zoneMs = (shape: ZoneShape) => {
    zoneFigures(shape, 'bench', a, sites)
    return median(Array.from({ length: 9 }, () => {
      const t = performance.now()
      zoneFigures(shape, 'bench', a, sites)
      return performance.now() - t
    }))
  }
  const centre = a.impactPoints[0]!.slice(0, 2) as [number, number]
  const ring = Array.from({ length: 60 }, (_, i) => destination(centre, i * 6, 40 + 10 * Math.sin(i)))
  console.log(`zone figures (${a.reach?.radiiKm.length ?? 0} realisations): circle ${zoneMs({ type: 'circle', centre, radiusKm: 40 }).toFixed(1)} ms, `
    + `60-corner polygon ${zoneMs({ type: 'polygon', ring }).toFixed(1)} ms (median)`)
}
