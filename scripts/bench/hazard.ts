/**
 * Benchmark of the hazard engine on the demo scenario's own orbit solutions and its 12 sites:
 * realisations per second of assessSolution at 20 000 and 200 000 samples, and the time of one
 * 20 000-sample assessment. Run: npm run bench (or node --import tsx scripts/bench/hazard.ts).
 */
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { assessSolution } from '../../shared/hazard/index'
import { parseScenarioYaml } from '../../shared/scenario/index'

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
