import { existsSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import {
  findHazardFields, formatScenarioError, parseScenarioYaml, renderHazardFields, stringifyScenario,
} from '../../../shared/scenario'
import type { Scenario } from '../../../shared/scenario'
import { assessmentFixture, siteFixture } from './fixtures'

const scenariosDir = fileURLToPath(new URL('../../../scenarios/', import.meta.url))
const read = (name: string) => readFileSync(`${scenariosDir}${name}`, 'utf8')

function load(name: string): Scenario {
  const result = parseScenarioYaml(read(name))
  if (!result.ok) throw new Error(`${name}:\n${result.errors.map(formatScenarioError).join('\n')}`)
  return result.scenario
}

/** Great-circle distance in km (spherical Earth, R = 6371 km). */
function distanceKm([lon1, lat1]: readonly [number, number], [lon2, lat2]: readonly [number, number]): number {
  const rad = Math.PI / 180
  const h = Math.sin(((lat2 - lat1) * rad) / 2) ** 2
    + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(((lon2 - lon1) * rad) / 2) ** 2
  return 2 * 6371 * Math.asin(Math.sqrt(h))
}

const DAY = 86_400_000
const DEMOS = ['demo-ocean-impact.yaml', 'demo-coastal-airburst.yaml', 'demo-approach.yaml']

describe.each(DEMOS)('%s', (name) => {
  const s = load(name)

  it('parses and validates', () => {
    expect(s.format).toBe('brinkwater-scenario/1')
    expect(`${s.key}.yaml`).toBe(name)
  })

  it('round-trips: file → object → YAML → the identical object, and again', () => {
    const text = stringifyScenario(s)
    const again = parseScenarioYaml(text)
    expect(again.ok && again.scenario).toEqual(s)
    expect(again.ok && stringifyScenario(again.scenario)).toBe(text)
  })

  it('gives every team and every phase injects, and every inject expected actions', () => {
    for (const team of s.teams) expect(s.injects.some(i => i.teams.includes(team.key)), team.key).toBe(true)
    for (const phase of s.phases) expect(s.injects.some(i => i.phase === phase.key), phase.key).toBe(true)
    for (const inject of s.injects) expect(inject.expectedActions.length, inject.key).toBeGreaterThan(0)
  })

  it('has evaluation criteria with critical tasks for every objective', () => {
    for (const objective of s.objectives) {
      const criteria = s.criteria.filter(c => c.objective === objective.key)
      expect(criteria.length, objective.key).toBeGreaterThan(0)
      for (const c of criteria) expect(c.tasks.length).toBeGreaterThan(0)
    }
  })

  it('ends with certain impact, with the impact probability never falling', () => {
    const p = s.solutions.map(x => x.solution.impactProbability)
    for (let i = 1; i < p.length; i++) expect(p[i]).toBeGreaterThan(p[i - 1] ?? 1)
    expect(p.at(-1)).toBe(1)
    expect(s.solutions.at(-1)?.solution.impactTime).toBe(s.clock.impactTime)
  })

  it('narrows the corridor and the size uncertainty with every solution', () => {
    const widths = s.solutions.map(x => x.solution.corridor.halfWidthKm)
    const along = s.solutions.map(x => x.solution.corridor.alongTrackSigmaKm)
    const sigmaH = s.solutions.map(x => x.solution.magnitude.sigma)
    for (let i = 1; i < widths.length; i++) {
      expect(widths[i]).toBeLessThan(widths[i - 1] ?? 0)
      expect(along[i]).toBeLessThan(along[i - 1] ?? 0)
      expect(sigmaH[i]).toBeLessThan(sigmaH[i - 1] ?? 0)
    }
    const last = s.solutions.at(-1)?.solution
    expect(last?.taxonomicClass).not.toBe('unknown')
    expect(last?.albedo).toBeDefined()
    expect(last?.densityKgM3).toBeDefined()
  })

  it('keeps every nominal point on its corridor path', () => {
    for (const { key, solution, encounter } of s.solutions) {
      const { path, nominal, halfWidthKm } = solution.corridor
      const nearest = Math.min(...path.map(p => distanceKm(p, nominal)))
      // A broad encounter cloud's nominal point may lie off the track of its hits, but within the corridor.
      if (encounter) expect(nearest, key).toBeLessThan(Math.max(1, halfWidthKm))
      else expect(nearest, key).toBeLessThan(1)
    }
  })

  it('uses hazard fields that render against an assessment of its own sites', () => {
    const a = assessmentFixture(s.sites.map(site => siteFixture(site.id, site.name, site.population)))
    for (const inject of s.injects) {
      const out = renderHazardFields(inject.body, a)
      expect(out, inject.key).not.toMatch(/\{\{|\[no figures|\[unknown hazard/)
    }
  })

  it('uses no real-style designations (MPC provisional format such as "2026 AB12")', () => {
    expect(read(name)).not.toMatch(/\b(19|20)\d\d [A-Z]{2}\d{0,3}\b/)
  })

  it('points attachments at files that ship in scenarios/', () => {
    for (const inject of s.injects) {
      for (const file of inject.attachments ?? []) expect(existsSync(`${scenariosDir}${file.path}`), file.path).toBe(true)
    }
  })
})

describe('demo-ocean-impact.yaml, the full demo', () => {
  const s = load('demo-ocean-impact.yaml')
  const first = s.solutions[0]?.solution
  const last = s.solutions.at(-1)?.solution
  if (!first || !last) throw new Error('no solutions')

  it('spans about six months of scenario time on a 3–4 hour wall plan', () => {
    const days = (Date.parse(s.clock.impactTime) - Date.parse(s.clock.scenarioStart)) / DAY
    expect(days).toBeGreaterThan(150)
    expect(days).toBeLessThan(220)
    expect(s.clock.plannedWallMinutes).toBeGreaterThanOrEqual(180)
    expect(s.clock.plannedWallMinutes).toBeLessThanOrEqual(240)
  })

  it('has at least six solutions, from well under 1 % to certainty', () => {
    expect(s.solutions.length).toBeGreaterThanOrEqual(6)
    expect(first.impactProbability).toBeLessThan(0.001)
  })

  it('narrows from an ocean-spanning band to a few kilometres', () => {
    const span = distanceKm(first.corridor.path[0] ?? [0, 0], first.corridor.path.at(-1) ?? [0, 0])
    expect(span).toBeGreaterThan(5000)
    expect(first.corridor.halfWidthKm).toBeGreaterThanOrEqual(300)
    expect(last.corridor.halfWidthKm).toBeLessThanOrEqual(5)
  })

  it('ends in the sea some tens of kilometres off the coast, in realistic water depth', () => {
    const coastal = s.sites.filter(site => site.beachSlopeDeg !== undefined)
    const nearest = Math.min(...coastal.map(site => distanceKm([site.lon, site.lat], last.corridor.nominal)))
    expect(nearest).toBeGreaterThan(20)
    expect(nearest).toBeLessThan(100)
    expect(last.waterDepthM).toBeGreaterThanOrEqual(100)
    expect(last.waterDepthM).toBeLessThanOrEqual(2000)
  })

  it('is a body of roughly 150–250 m that becomes a known stony class', () => {
    for (const { solution } of s.solutions) {
      expect(solution.magnitude.H).toBeGreaterThanOrEqual(21)
      expect(solution.magnitude.H).toBeLessThanOrEqual(22)
    }
    expect(first.taxonomicClass).toBe('unknown')
    expect(last.taxonomicClass).toBe('S')
    const albedoWidths = s.solutions.flatMap(x => (x.solution.albedo ? [x.solution.albedo.max - x.solution.albedo.min] : []))
    for (let i = 1; i < albedoWidths.length; i++) expect(albedoWidths[i]).toBeLessThan(albedoWidths[i - 1] ?? 0)
  })

  it('has about twelve realistic sites on the coast and inland', () => {
    expect(s.sites.length).toBeGreaterThanOrEqual(10)
    expect(s.sites.length).toBeLessThanOrEqual(14)
    for (const site of s.sites) {
      if (site.offshoreDepthM !== undefined) expect(site.offshoreDepthM).toBeGreaterThanOrEqual(20)
      if (site.offshoreDepthM !== undefined) expect(site.offshoreDepthM).toBeLessThanOrEqual(100)
      if (site.beachSlopeDeg !== undefined) expect(site.beachSlopeDeg).toBeGreaterThanOrEqual(1)
      if (site.beachSlopeDeg !== undefined) expect(site.beachSlopeDeg).toBeLessThanOrEqual(5)
    }
  })

  it('has at least 25 injects, with media queries, decisions with deadlines and choices, and contingencies', () => {
    expect(s.injects.length).toBeGreaterThanOrEqual(25)
    expect(s.injects.filter(i => i.kind === 'media-query').length).toBeGreaterThanOrEqual(4)
    expect(s.injects.filter(i => i.decision?.choices && i.decision.deadline).length).toBeGreaterThanOrEqual(8)
    expect(s.injects.filter(i => i.contingency).length).toBeGreaterThanOrEqual(2)
    expect(s.injects.filter(i => findHazardFields(i.body).length > 0).length).toBeGreaterThanOrEqual(20)
  })

  it('releases every solution through a data-release inject', () => {
    for (const { key } of s.solutions) expect(s.injects.some(i => i.kind === 'data-release' && i.solution === key), key).toBe(true)
  })
})

describe('demo-coastal-airburst.yaml, the contrast', () => {
  const s = load('demo-coastal-airburst.yaml')

  it('is short: days to weeks, with at least three solutions and eight injects', () => {
    const days = (Date.parse(s.clock.impactTime) - Date.parse(s.clock.scenarioStart)) / DAY
    expect(days).toBeLessThan(30)
    expect(s.solutions.length).toBeGreaterThanOrEqual(3)
    expect(s.injects.length).toBeGreaterThanOrEqual(8)
  })

  it('is a small object (H about 24–26, some 20–40 m) ending over shallow water near the coast', () => {
    const last = s.solutions.at(-1)?.solution
    expect(last?.magnitude.H).toBeGreaterThanOrEqual(23.5)
    expect(last?.magnitude.H).toBeLessThanOrEqual(26)
    const nearest = Math.min(...s.sites.map(site => distanceKm([site.lon, site.lat], last?.corridor.nominal ?? [0, 0])))
    expect(nearest).toBeLessThan(30)
  })

  it('asks about the blast and windows, and about the tsunami that does not come', () => {
    const fields = s.injects.flatMap(i => findHazardFields(i.body).map(f => f.path))
    expect(fields).toContain('airburstProbability')
    expect(fields).toContain('tsunamiProbability')
    expect(fields.some(f => f.endsWith('exceedance.windows'))).toBe(true)
  })
})
