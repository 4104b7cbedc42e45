// Rebuilds the `solutions:` section of scenarios/demo-ocean-impact.yaml from one invented close encounter of the
// fictional TRS-31-Gannet: one radiant, v∞ and impact time, the true impact point some 50 km west of the (invented)
// town of Pinhal-Mar, and seven solutions whose b-plane uncertainty shrinks as the arc grows. Each solution's nominal
// b-plane point is the one that lands on its nominal ground point at the impact time (findBPlanePoint): the nominals
// walk along the line of variations from the mid-Atlantic to the true point, as refined orbits do. Impact probability,
// corridor, entry speed and entry angle are then computed from the encounter (applyEncounter); every other field of
// each solution (key, label, release, epoch, magnitude, class, albedo, density, water depth at the nominal point) is
// kept from the file. The rest of the file is by hand.
// Run: node --import tsx scripts/demo-ocean-impact.ts           (prints the section and a summary)
//      node --import tsx scripts/demo-ocean-impact.ts --write   (writes it into the file)
import { readFileSync, writeFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { findBPlanePoint, greenwichSiderealDeg } from '../shared/encounter'
import { isLand } from '../shared/hazard'
import { applyEncounter } from '../shared/scenario/encounter'
import { parseScenarioYaml, stringifyScenario } from '../shared/scenario'
import type { Scenario, SolutionEntry } from '../shared/scenario'

const file = resolve(import.meta.dirname, '../scenarios/demo-ocean-impact.yaml')
const text = readFileSync(file, 'utf8')
const parsed = parseScenarioYaml(text)
if (!parsed.ok) throw new Error(`demo-ocean-impact.yaml invalid: ${JSON.stringify(parsed.errors[0])}`)
const scenario = parsed.scenario

/** The impact: the clock's impact time, at the true point (about 50 km west of Pinhal-Mar, 450 m of water). */
const timeUtc = scenario.clock.impactTime
const truth: [number, number] = [-9.55, 39.95]
/** v∞ 13.6 km/s: entry at sqrt(13.6² + 11.186²) = 17.61 km/s. */
const vInfKmS = 13.6
/**
 * Radiant: 22° of right ascension east of the impact point's meridian, 16° south: the body comes from the south-south-east
 * and enters at 37.6° (tested by the summary below), heading north-north-west.
 */
const radiant = { raDeg: Number(((greenwichSiderealDeg(timeUtc) + truth[0] + 22 + 720) % 360).toFixed(2)), decDeg: -16 }

const bPlane = (target: readonly [number, number]) => {
  const p = findBPlanePoint({ vInfKmS, radiant, timeUtc, target: [target[0], target[1]] })
  if (!p) throw new Error(`${target.join(', ')} cannot be reached from the radiant`)
  return { xiKm: Number(p.xiKm.toFixed(3)), zetaKm: Number(p.zetaKm.toFixed(3)) }
}
const truePoint = bPlane(truth)
/**
 * The line of variations is perpendicular to the true point's b vector: the true point is its closest approach to the
 * Earth's centre, so entries are steepest there and graze at both ends; its ground track runs from North America
 * across the Atlantic past the Western Shore (west-south-west to east-north-east there) and on over Europe.
 */
const lineAngleDeg = Number((Math.atan2(truePoint.zetaKm, truePoint.xiKm) * 180 / Math.PI + 90).toFixed(2))

/**
 * Per solution (in release order): its nominal ground point (where its nominal b-plane point lands) or, for a nominal
 * that misses the Earth, its b-plane offset from the true point along and across the line of variations (km); the
 * 1-sigma b-plane uncertainty along and across the line (km); and the samples of the encounter. The first nominal
 * misses (a few in ten thousand can only come from the tail of the cloud: a nominal on the Earth gives at least
 * about 0.003 for any uncertainty the format allows); its corridor's nominal is then the median hit's point.
 */
interface SeriesEntry {
  nominal: [number, number] | { alongKm: number; acrossKm: number }
  along: number
  across: number
  samples?: number
  waterDepthM?: number
}
const series: SeriesEntry[] = [
  // The median hit of the first solution lies on land (the Sahara): water depth 0, as the format asks.
  { nominal: { alongKm: 0, acrossKm: -7714 }, along: 1_000_000, across: 6000, samples: 200_000, waterDepthM: 0 },
  { nominal: [-18.9, 36.533], along: 1_000_000, across: 2000, samples: 100_000 },
  { nominal: [-14.023, 38.448], along: 137_000, across: 150 },
  { nominal: [-10.74, 39.573], along: 25_000, across: 45 },
  { nominal: [-9.789, 39.876], along: 5600, across: 13 },
  { nominal: [-9.583, 39.94], along: 2300, across: 4 },
  { nominal: truth, along: 60, across: 1.5 },
]
if (series.length !== scenario.solutions.length) throw new Error('one series entry per solution')

const psi = lineAngleDeg * Math.PI / 180
const nominalOf = (n: SeriesEntry['nominal']) => Array.isArray(n)
  ? bPlane(n)
  : {
      xiKm: Number((truePoint.xiKm + n.alongKm * Math.cos(psi) - n.acrossKm * Math.sin(psi)).toFixed(3)),
      zetaKm: Number((truePoint.zetaKm + n.alongKm * Math.sin(psi) + n.acrossKm * Math.cos(psi)).toFixed(3)),
    }

const solutions = scenario.solutions.map((entry, i): SolutionEntry => {
  const s = series[i]!
  const { encounter: _old, ...rest } = entry
  return applyEncounter({
    ...rest,
    solution: { ...entry.solution, impactTime: timeUtc, ...(s.waterDepthM !== undefined ? { waterDepthM: s.waterDepthM } : {}) },
    encounter: {
      vInfKmS, radiant, timeUtc, nominal: nominalOf(s.nominal), sigmaAlongKm: s.along, sigmaAcrossKm: s.across, lineAngleDeg,
      ...(s.samples ? { samples: s.samples } : {}), seed: i + 1,
    },
  })
})

const km = (a: readonly [number, number], b: readonly [number, number]) => {
  const r = Math.PI / 180
  const h = Math.sin((b[1] - a[1]) * r / 2) ** 2 + Math.cos(a[1] * r) * Math.cos(b[1] * r) * Math.sin((b[0] - a[0]) * r / 2) ** 2
  return 2 * 6371 * Math.asin(Math.sqrt(h))
}
const pinhal = scenario.sites.find(site => site.id === 'pinhal-mar')!
console.error(`radiant ${JSON.stringify(radiant)}, v∞ ${vInfKmS} km/s, line of variations ${lineAngleDeg}°, true point ${JSON.stringify(truePoint)}`)
for (const { key, solution: { impactProbability, corridor, entryAngleDeg, entrySpeedKmS, waterDepthM } } of solutions) {
  const length = corridor.path.slice(1).reduce((sum, p, j) => sum + km(corridor.path[j]!, p), 0)
  console.error(`${key}: P ${impactProbability}, half-width ${corridor.halfWidthKm} km, along σ ${corridor.alongTrackSigmaKm} km, `
    + `track ${Math.round(length)} km from ${corridor.path[0]!.join(', ')} to ${corridor.path.at(-1)!.join(', ')}, `
    + `nominal ${corridor.nominal.join(', ')} (${isLand(...corridor.nominal) ? 'land' : 'sea'}, ${waterDepthM} m, `
    + `${Math.round(km(corridor.nominal, [pinhal.lon, pinhal.lat]))} km from Pinhal-Mar), `
    + `angle ${entryAngleDeg.mean} ± ${entryAngleDeg.sigma}°, speed ${entrySpeedKmS.mean} km/s`)
}

const section = stringifyScenario({ solutions } as unknown as Scenario).replace(/^#.*\n/, '').replace(/^\n+/, '')
if (process.argv.includes('--write')) {
  const start = text.indexOf('\nsolutions:\n'), end = text.indexOf('\nsites:\n')
  if (start < 0 || end < start) throw new Error('no solutions section')
  writeFileSync(file, `${text.slice(0, start + 1)}${section}${text.slice(end + 1)}`)
  console.error(`wrote ${file}`)
}
else console.log(section)
