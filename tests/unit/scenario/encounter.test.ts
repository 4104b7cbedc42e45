import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { findBPlanePoint, greenwichSiderealDeg } from '../../../shared/encounter'
import {
  ENCOUNTER_SAMPLE_BUDGET, ENCOUNTER_TOLERANCE, applyEncounter, checkEncounters, encounterSchema, formatScenarioError, greatCircleKm,
  parseScenarioYaml,
  solutionEntrySchema, validateScenario,
} from '../../../shared/scenario'
import type { ScenarioEncounter, SolutionEntry } from '../../../shared/scenario'
import { MINI_YAML } from './fixtures'

const timeUtc = '2031-02-01T00:00:00Z'
const target: [number, number] = [-9.5, 39.5]
// A radiant some 35° east and 10° south of the target's zenith at impact: a moderate entry.
const radiant = { raDeg: (greenwichSiderealDeg(timeUtc) + target[0] + 35 + 360) % 360, decDeg: target[1] - 10 }
const nominal = findBPlanePoint({ vInfKmS: 15, radiant, timeUtc, target })!

function encounter(sigmaAlongKm: number, sigmaAcrossKm: number): ScenarioEncounter {
  return { vInfKmS: 15, radiant, timeUtc, nominal, sigmaAlongKm, sigmaAcrossKm, lineAngleDeg: 20, samples: 5000, seed: 3 }
}

function mini() {
  const r = parseScenarioYaml(MINI_YAML)
  if (!r.ok) throw new Error('fixture does not parse')
  return r.scenario
}

describe('encounterSchema', () => {
  it('takes an encounter and rejects values out of range or unknown keys', () => {
    expect(encounterSchema.safeParse(encounter(5000, 300)).success).toBe(true)
    expect(encounterSchema.safeParse({ ...encounter(5000, 300), vInfKmS: 0.3 }).success).toBe(false)
    expect(encounterSchema.safeParse({ ...encounter(5000, 300), radiant: { raDeg: 10, decDeg: 95 } }).success).toBe(false)
    expect(encounterSchema.safeParse({ ...encounter(-1, 300) }).success).toBe(false)
    expect(encounterSchema.safeParse({ ...encounter(5000, 300), samples: 10 }).success).toBe(false)
    expect(encounterSchema.safeParse({ ...encounter(5000, 300), timeUtc: 'tomorrow' }).success).toBe(false)
    expect(encounterSchema.safeParse({ ...encounter(5000, 300), extra: 1 }).success).toBe(false)
  })

  it('is an optional part of a solution entry', () => {
    const entry = mini().solutions[0]!
    expect(solutionEntrySchema.safeParse(entry).success).toBe(true)
    expect(solutionEntrySchema.safeParse({ ...entry, encounter: encounter(5000, 300) }).success).toBe(true)
  })
})

describe('applyEncounter', () => {
  const entry = mini().solutions[0]!

  it('leaves an entry without an encounter alone', () => {
    expect(applyEncounter(entry)).toBe(entry)
  })

  it('computes probability, corridor, speed and angle, and keeps the rest', () => {
    const out = applyEncounter({ ...entry, encounter: encounter(400, 40) })
    expect(out.solution.impactProbability).toBe(1)
    expect(greatCircleKm(out.solution.corridor.nominal, target)).toBeLessThan(1)
    expect(out.solution.corridor.path.some(p => greatCircleKm(p, out.solution.corridor.nominal) < 0.01)).toBe(true)
    expect(out.solution.corridor.path.length).toBeLessThanOrEqual(42)
    expect(out.solution.entrySpeedKmS.mean).toBeCloseTo(Math.sqrt(15 ** 2 + 11.186 ** 2), 1)
    expect(out.solution.entryAngleDeg?.mean).toBeGreaterThan(5)
    const { impactProbability, corridor, entrySpeedKmS, entryAngleDeg, ...rest } = out.solution
    const { impactProbability: _p, corridor: _c, entrySpeedKmS: _s, entryAngleDeg: _a, ...before } = entry.solution
    expect(rest).toEqual(before)
    expect([impactProbability, corridor, entrySpeedKmS, entryAngleDeg]).toBeDefined()
    expect(out.key).toBe(entry.key)
    expect(solutionEntrySchema.safeParse(out).success).toBe(true)
  })

  it('makes the probability climb and the corridor narrow as the uncertainty shrinks', () => {
    const series = [[60_000, 3000], [12_000, 600], [800, 60]]
      .map(([a, c]) => applyEncounter({ ...entry, encounter: encounter(a!, c!) }).solution)
    for (let i = 1; i < series.length; i++) {
      expect(series[i]!.impactProbability).toBeGreaterThan(series[i - 1]!.impactProbability)
      expect(series[i]!.corridor.halfWidthKm).toBeLessThan(series[i - 1]!.corridor.halfWidthKm)
      expect(series[i]!.corridor.alongTrackSigmaKm).toBeLessThan(series[i - 1]!.corridor.alongTrackSigmaKm)
    }
  })

  it('is deterministic for the same encounter and seed', () => {
    const a = applyEncounter({ ...entry, encounter: encounter(9000, 500) })
    const b = applyEncounter(structuredClone({ ...entry, encounter: encounter(9000, 500) }))
    expect(b).toEqual(a)
  })
})

describe('checkEncounters and the scenario checks', () => {
  function withEncounter(): SolutionEntry[] {
    const s = mini()
    return s.solutions.map(e => applyEncounter({ ...e, encounter: encounter(5000, 300) }))
  }

  it('accepts a solution computed from its encounter, and one without', () => {
    expect(checkEncounters(withEncounter())).toEqual([])
    expect(checkEncounters(mini().solutions)).toEqual([])
    const s = mini()
    s.solutions = withEncounter()
    expect(validateScenario(s).ok).toBe(true)
  })

  it('reports a probability or a nominal point off by more than the tolerance, with paths', () => {
    const solutions = withEncounter()
    const sol = solutions[0]!.solution
    sol.impactProbability = Math.min(1, sol.impactProbability + ENCOUNTER_TOLERANCE.probability * 3)
    sol.corridor.nominal = [sol.corridor.nominal[0] + 1, sol.corridor.nominal[1]]
    const issues = checkEncounters(solutions)
    expect(issues.map(i => i.path)).toEqual([
      ['solutions', 0, 'solution', 'impactProbability'],
      ['solutions', 0, 'solution', 'corridor', 'nominal'],
    ])
    const s = mini()
    s.solutions = solutions
    const r = validateScenario(s)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.errors.map(e => e.path)).toContain('solutions[0].solution.impactProbability')
  })

  it('draws no more than the sample budget for one scenario, and says so', () => {
    const solutions = withEncounter()
    const one = applyEncounter({ ...solutions[0]!, encounter: { ...encounter(5000, 300), samples: 200_000 } })
    const big = Array.from({ length: 6 }, () => one)
    const issues = checkEncounters(big)
    expect(issues.map(i => i.path)).toContainEqual(['solutions', 5, 'encounter', 'samples'])
    expect(issues.every(i => i.path.at(-1) === 'samples')).toBe(true)
    expect(5 * 200_000).toBeLessThanOrEqual(ENCOUNTER_SAMPLE_BUDGET)
  })

  it('tolerates small differences (rounding in a file)', () => {
    const solutions = withEncounter()
    const sol = solutions[0]!.solution
    sol.impactProbability = Math.max(0, sol.impactProbability - ENCOUNTER_TOLERANCE.probability / 2)
    sol.corridor.nominal = [sol.corridor.nominal[0] + 0.01, sol.corridor.nominal[1]]
    expect(checkEncounters(solutions)).toEqual([])
  })
})

describe('scenarios/demo-approach.yaml', () => {
  const text = readFileSync(fileURLToPath(new URL('../../../scenarios/demo-approach.yaml', import.meta.url)), 'utf8')
  const r = parseScenarioYaml(text)
  if (!r.ok) throw new Error(r.errors.map(formatScenarioError).join('\n'))
  const s = r.scenario

  it('parses with the project parser, and the checker finds nothing', () => {
    expect(s.key).toBe('demo-approach')
    expect(s.clock.timeZone).toBeDefined()
    expect(checkEncounters(s.solutions)).toEqual([])
  })

  it('is small: two teams, three solutions, about four injects', () => {
    expect(s.teams).toHaveLength(2)
    expect(s.solutions).toHaveLength(3)
    expect(s.injects.length).toBeGreaterThanOrEqual(3)
    expect(s.injects.length).toBeLessThanOrEqual(6)
  })

  it('computes every solution from one encounter with shrinking uncertainties', () => {
    const encounters = s.solutions.map(x => x.encounter!)
    expect(encounters.every(Boolean)).toBe(true)
    const shared = ({ sigmaAlongKm: _a, sigmaAcrossKm: _c, seed: _s, ...rest }: ScenarioEncounter) => rest
    for (const e of encounters) expect(shared(e)).toEqual(shared(encounters[0]!))
    for (let i = 1; i < encounters.length; i++) {
      expect(encounters[i]!.sigmaAlongKm).toBeLessThan(encounters[i - 1]!.sigmaAlongKm)
      expect(encounters[i]!.sigmaAcrossKm).toBeLessThan(encounters[i - 1]!.sigmaAcrossKm)
    }
    expect(encounters[0]!.timeUtc).toBe(s.clock.impactTime)
  })

  it('stores exactly what applyEncounter gives (regenerate with scripts/demo-approach.ts)', () => {
    for (const entry of s.solutions) expect(applyEncounter(entry).solution, entry.key).toEqual(entry.solution)
  })
})
