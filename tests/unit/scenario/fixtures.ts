/** Test fixtures: a small valid scenario file and a hand-made assessment. */
import type { Assessment, Percentiles, SiteAssessment, ThresholdKey } from '../../../shared/hazard/types'
import { THRESHOLDS } from '../../../shared/hazard/types'

/** A minimal valid scenario; tests mutate single lines of it. */
export const MINI_YAML = `format: brinkwater-scenario/1
key: mini
title: Mini drill
summary: A tiny scenario for tests.
objectives:
  - key: warn
    title: Warn the public
    description: Warn the public in time.
    capabilities: [Public Information and Warning]
teams:
  - key: science
    name: Science
    colour: "#2563eb"
  - key: comms
    name: Comms
    colour: "#16a34a"
clock:
  scenarioStart: 2031-01-01T00:00:00Z
  impactTime: 2031-02-01T00:00:00Z
  plannedWallMinutes: 60
phases:
  - key: detection
    title: Detection
  - key: impact
    title: Impact
solutions:
  - key: s1
    label: First
    releaseAt: 2031-01-02T00:00:00Z
    solution:
      epoch: 2031-01-02T00:00:00Z
      impactTime: 2031-02-01T00:00:00Z
      impactProbability: 0.01
      magnitude: { H: 22, sigma: 0.3 }
      entrySpeedKmS: { mean: 18, sigma: 0.5 }
      corridor:
        path: [[-10, 39], [-9, 40]]
        halfWidthKm: 50
        nominal: [-9.5, 39.5]
        alongTrackSigmaKm: 100
      waterDepthM: 1000
sites:
  - { id: port-a, name: Port A, lon: -8.8, lat: 40.1, population: 1000, offshoreDepthM: 30, beachSlopeDeg: 2 }
injects:
  - key: first-news
    at: 2031-01-02T06:00:00Z
    phase: detection
    kind: briefing
    teams: [science]
    title: First news
    body: |
      Probability {{ impactProbability }}.
      Run-up at Port A {{ site.port-a.runUpM.p95 }}.
    expectedActions: [Read the figures]
  - key: press-call
    at: 2031-01-03T06:00:00Z
    phase: detection
    kind: media-query
    teams: [comms, science]
    title: Press call
    body: A reporter calls.
    decision:
      prompt: What do you say?
      choices: [Statement, No comment]
      freeText: true
      deadline: 2031-01-03T12:00:00Z
    expectedActions: [Issue a holding statement]
criteria:
  - key: warn-early
    objective: warn
    capability: Public Information and Warning
    tasks:
      - key: statement
        text: Issue a statement the same day.
    injects: [press-call]
`

/** 1-based line and column of the first occurrence of `needle` in `text`. */
export function positionOf(text: string, needle: string): { line: number; column: number } {
  const offset = text.indexOf(needle)
  if (offset < 0) throw new Error(`not in text: ${needle}`)
  const before = text.slice(0, offset).split('\n')
  return { line: before.length, column: (before.at(-1)?.length ?? 0) + 1 }
}

const pc = (p5: number, p50: number, p95: number): Percentiles => ({ p5, p50, p95 })

function thresholds(value: (key: ThresholdKey, i: number) => number): Record<ThresholdKey, number> {
  return Object.fromEntries(THRESHOLDS.map((t, i) => [t.key, value(t.key, i)])) as Record<ThresholdKey, number>
}

/** A site's figures, hand-made; the same for every site unless overridden. */
export function siteFixture(siteId: string, name: string, population: number, over: Partial<SiteAssessment> = {}): SiteAssessment {
  return {
    siteId, name, population,
    distanceKm: pc(38.2, 43.7, 51.5),
    overpressureKPa: pc(2.1, 3.4, 6.9),
    windMS: pc(4.4, 7.2, 14.6),
    thermalMJM2: pc(0.012, 0.034, 0.071),
    seismicMagnitude: pc(4.87, 5.31, 5.62),
    tsunamiAmplitudeM: pc(0.9, 2.2, 4.1),
    tsunamiArrivalMin: pc(18.2, 23.4, 31.0),
    tsunamiMainArrivalMin: pc(21.0, 27.5, 36.0),
    runUpM: pc(1.2, 2.6, 4.63),
    exceedance: thresholds(key => (key === 'runUp3m' ? 0.41 : key === 'windows' ? 0.2 : 0)),
    ...over,
  }
}

/** A hand-made assessment with round, recognisable figures (not engine output). */
export function assessmentFixture(sites: SiteAssessment[] = [siteFixture('port-a', 'Port A', 61500)]): Assessment {
  return {
    modelVersion: 'fixture',
    options: { samples: 1000, seed: 1, strengthModel: 'density' },
    impactProbability: 0.0213,
    diameterM: pc(121, 187, 262),
    massKg: pc(2.5e9, 8.2e9, 1.9e10),
    energyMt: pc(0.8, 2.1, 4.6),
    airburstProbability: 0.997,
    burstAltitudeKm: null,
    oceanImpactProbability: 0.93,
    tsunamiProbability: 0.9,
    surfaceEnergyMt: pc(0.5, 1.7, 4.1),
    waterCavityDiameterM: pc(1800, 2900, 3400),
    sites,
    exposedPopulation: thresholds((_, i) => (i === 0 ? 123456.7 : 1000 / (i + 1))),
    torino: 3,
    palermo: -1.234,
    warnings: [],
    impactPoints: [],
  }
}
