/**
 * The `encounter:` block of a solution entry: the close-encounter geometry (radiant, v∞, time, nominal b-plane point
 * and its uncertainty) from which the encounter engine (shared/encounter) computes the solution's impact probability,
 * corridor, entry speed and entry angle. `applyEncounter` writes those four fields; `checkEncounters` reports a
 * solution that disagrees with its own encounter, so that a file stays consistent. For training exercises only.
 */
import { z } from 'zod'
import { solutionFromEncounter, MIN_ENCOUNTER_HIT_SHARE } from '../encounter'
import type { EncounterSolution } from '../encounter'
import type { OrbitSolution } from '../hazard/schema'
import { scenarioTimeSchema } from './time'

/** Largest distance of a nominal b-plane point from the Earth's centre, km (a lunar distance: beyond it, no encounter). */
export const MAX_B_PLANE_KM = 400_000
/** Samples per encounter: 1 000 to 200 000 (default 20 000 in the engine). */
export const ENCOUNTER_SAMPLES = { min: 1000, max: 200_000 } as const

export const encounterSchema = z.strictObject({
  /** Hyperbolic excess speed, km/s (1–70: slower approaches are shaped by the Sun and Moon, faster ones exceed 72 km/s entry). */
  vInfKmS: z.number().min(1).max(70),
  /** Geocentric radiant (where the body comes from), of date, degrees. */
  radiant: z.strictObject({ raDeg: z.number().min(0).max(360), decDeg: z.number().min(-90).max(90) }),
  /** When the nominal body reaches the ground (ISO 8601). */
  timeUtc: scenarioTimeSchema,
  /** Nominal b-plane point, km (project axes: ξ east, ζ north; see shared/encounter/README.md). */
  nominal: z.strictObject({
    xiKm: z.number().min(-MAX_B_PLANE_KM).max(MAX_B_PLANE_KM),
    zetaKm: z.number().min(-MAX_B_PLANE_KM).max(MAX_B_PLANE_KM),
  }),
  /** 1-sigma uncertainty along the line of variations and across it, km. */
  sigmaAlongKm: z.number().min(0).max(1_000_000),
  sigmaAcrossKm: z.number().min(0).max(100_000),
  /** Direction of the line of variations from ξ towards ζ, degrees. */
  lineAngleDeg: z.number().min(-360).max(360),
  samples: z.number().int().min(ENCOUNTER_SAMPLES.min).max(ENCOUNTER_SAMPLES.max).optional(),
  seed: z.number().int().min(0).max(2 ** 31 - 1).optional(),
})
export type ScenarioEncounter = z.infer<typeof encounterSchema>

/** Most samples that the checks of one scenario draw in all (about a quarter of a second): a file cannot ask for more. */
export const ENCOUNTER_SAMPLE_BUDGET = 1_000_000
const DEFAULT_SAMPLES = 20_000

/** Tolerances of checkEncounters: impact probability (absolute) and nominal impact point (km). */
export const ENCOUNTER_TOLERANCE = { probability: 0.005, nominalKm: 5 } as const

const cache = new Map<string, EncounterSolution>()

/** The engine's result for an encounter (cached: the editor and the checker ask for the same ones again and again). */
export function encounterSolution(encounter: ScenarioEncounter): EncounterSolution {
  const key = JSON.stringify(encounter)
  let result = cache.get(key)
  if (!result) {
    const { samples, seed, ...input } = encounter
    result = solutionFromEncounter(input, { samples, seed })
    if (cache.size >= 64) cache.delete(cache.keys().next().value as string)
    cache.set(key, result)
  }
  return result
}

const round = (v: number, digits: number) => Number(v.toFixed(digits))
const lonLat = ([lon, lat]: readonly [number, number]): [number, number] => [round(lon, 4), round(lat, 4)]

/** Great-circle distance, km (spherical Earth, R = 6371 km). */
export function greatCircleKm([lon1, lat1]: readonly [number, number], [lon2, lat2]: readonly [number, number]): number {
  const rad = Math.PI / 180
  const h = Math.sin(((lat2 - lat1) * rad) / 2) ** 2
    + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(((lon2 - lon1) * rad) / 2) ** 2
  return 2 * 6371 * Math.asin(Math.min(1, Math.sqrt(h)))
}

/** Distance of a point from a short segment, km, in the local plane of the point (equirectangular). */
function segmentKm(p: readonly [number, number], a: readonly [number, number], b: readonly [number, number]): number {
  const k = 111.195, c = Math.cos(p[1] * Math.PI / 180)
  const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180
  const ax = wrap(a[0] - p[0]) * k * c, ay = (a[1] - p[1]) * k, bx = wrap(b[0] - p[0]) * k * c, by = (b[1] - p[1]) * k
  const dx = bx - ax, dy = by - ay, len2 = dx * dx + dy * dy
  const t = len2 > 0 ? Math.min(1, Math.max(0, -(ax * dx + ay * dy) / len2)) : 0
  return Math.hypot(ax + t * dx, ay + t * dy)
}

/**
 * Every `step`-th node of a track (both ends kept). When the nominal point lies on the track (within
 * NOMINAL_ON_TRACK_KM of a segment), it becomes a node itself, so that the thinned track still passes through it; a
 * broad cloud's nominal point can lie off the hits' track (see shared/encounter/README.md), and is then left off it.
 */
function thinTrack(path: ReadonlyArray<[number, number]>, nominal: [number, number], step: number): Array<[number, number]> {
  const out = path.filter((_, i) => i % step === 0 || i === path.length - 1).map(lonLat)
  let best = -1, bestKm = Infinity
  for (let i = 0; i + 1 < out.length; i++) {
    const d = segmentKm(nominal, out[i]!, out[i + 1]!)
    if (d < bestKm) { bestKm = d; best = i }
  }
  if (best < 0 || bestKm > NOMINAL_ON_TRACK_KM) return out
  if (out.some(p => greatCircleKm(p, nominal) < 0.01)) return out
  out.splice(best + 1, 0, [nominal[0], nominal[1]])
  return out
}

/** Largest distance of the nominal point from the thinned track at which it is put on the track, km. */
const NOMINAL_ON_TRACK_KM = 3

/** Node step of a stored corridor: the engine's 241 nodes thinned to 41 (plus the nominal point). */
const TRACK_STEP = 6

/**
 * The entry with `solution.impactProbability`, `corridor`, `entrySpeedKmS` and `entryAngleDeg` computed from its
 * encounter (rounded for the file: 4 decimals of a degree, 0.1 km); every other field is kept. Without an encounter,
 * or when no sample hits (no corridor), the corridor is kept and only the other fields follow the encounter.
 */
export function applyEncounter<E extends { solution: OrbitSolution; encounter?: ScenarioEncounter }>(entry: E): E {
  if (!entry.encounter) return entry
  const r = encounterSolution(entry.encounter)
  const solution: OrbitSolution = {
    ...entry.solution,
    impactProbability: r.impactProbability,
    entrySpeedKmS: { mean: round(r.entrySpeedKmS.mean, 2), sigma: round(r.entrySpeedKmS.sigma, 2) },
    entryAngleDeg: { mean: round(r.entryAngleDeg.mean, 1), sigma: round(r.entryAngleDeg.sigma, 1) },
  }
  if (r.corridor) {
    const nominal = lonLat(r.corridor.nominal)
    solution.corridor = {
      path: thinTrack(r.corridor.path, nominal, TRACK_STEP),
      halfWidthKm: round(r.corridor.halfWidthKm, 1),
      nominal,
      alongTrackSigmaKm: round(r.corridor.alongTrackSigmaKm, 1),
    }
  }
  return { ...entry, solution }
}

/**
 * The orbit solution of an entry as the hazard engine takes it: with `sampling: 'encounter'` the entry's encounter
 * geometry is joined to it (the engine draws impacts from it); otherwise the solution itself, unchanged, so that a
 * corridor draw gets exactly the same input as before the option existed.
 */
export function engineSolution(entry: { solution: OrbitSolution; encounter?: ScenarioEncounter }): OrbitSolution {
  if (entry.solution.sampling !== 'encounter' || !entry.encounter) return entry.solution
  const { samples: _samples, seed: _seed, ...geometry } = entry.encounter
  return { ...entry.solution, encounter: geometry }
}

/** A disagreement between a solution and its encounter, at a path into the scenario. */
export interface EncounterIssue { path: Array<string | number>; message: string }

/**
 * Solutions whose figures disagree with their own `encounter:`: impact probability off by more than
 * ENCOUNTER_TOLERANCE.probability, or the corridor's nominal point more than ENCOUNTER_TOLERANCE.nominalKm away;
 * encounters beyond ENCOUNTER_SAMPLE_BUDGET samples in all are not computed but reported.
 */
export function checkEncounters(solutions: ReadonlyArray<{ solution: OrbitSolution; encounter?: ScenarioEncounter }>): EncounterIssue[] {
  const issues: EncounterIssue[] = []
  let drawn = 0
  solutions.forEach((entry, i) => {
    if (entry.solution.sampling === 'encounter' && !entry.encounter) {
      issues.push({
        path: ['solutions', i, 'solution', 'sampling'],
        message: 'impacts can be drawn from the approach geometry only when the solution has its encounter: give one or draw from the corridor',
      })
    }
    if (!entry.encounter) return
    drawn += entry.encounter.samples ?? DEFAULT_SAMPLES
    if (drawn > ENCOUNTER_SAMPLE_BUDGET) {
      issues.push({
        path: ['solutions', i, 'encounter', 'samples'],
        message: `the encounters of this scenario draw more than ${ENCOUNTER_SAMPLE_BUDGET.toLocaleString('en-GB')} samples in all: give fewer samples`,
      })
      return
    }
    const path = ['solutions', i, 'solution']
    let r: EncounterSolution
    try { r = encounterSolution(entry.encounter) }
    catch (e) {
      issues.push({ path: ['solutions', i, 'encounter'], message: `the encounter cannot be computed: ${(e as Error).message}` })
      return
    }
    if (entry.solution.sampling === 'encounter' && r.impactProbability < MIN_ENCOUNTER_HIT_SHARE) {
      issues.push({
        path: [...path, 'sampling'],
        message: `under ${MIN_ENCOUNTER_HIT_SHARE * 100} % of the encounter's b-plane points hit the Earth: too few to draw impacts from the approach geometry; draw them from the corridor`,
      })
    }
    const p = entry.solution.impactProbability
    if (Math.abs(p - r.impactProbability) > ENCOUNTER_TOLERANCE.probability) {
      issues.push({
        path: [...path, 'impactProbability'],
        message: `impact probability ${p} disagrees with the encounter (${r.impactProbability}): apply the encounter again`,
      })
    }
    if (r.corridor) {
      const d = greatCircleKm(entry.solution.corridor.nominal, r.corridor.nominal)
      if (d > ENCOUNTER_TOLERANCE.nominalKm) {
        issues.push({
          path: [...path, 'corridor', 'nominal'],
          message: `the nominal impact point is ${Math.round(d)} km from the encounter's (${lonLat(r.corridor.nominal).join(', ')}): apply the encounter again`,
        })
      }
    }
  })
  return issues
}
