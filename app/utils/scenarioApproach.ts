// The editor's approach form: one close encounter for the whole scenario (radiant, v∞, impact time, the true impact
// point) and a shrinking series of b-plane uncertainties, one per solution. Pure helpers; the panel holds the state.
import { entryFromBPlane, findBPlanePoint, greenwichSiderealDeg } from '~~/shared/encounter'
import type { BPlanePoint } from '~~/shared/encounter'
import { encounterSchema } from '~~/shared/scenario/encounter'
import type { ScenarioEncounter } from '~~/shared/scenario/encounter'
import type { Scenario } from '~~/shared/scenario'

export interface ApproachSigma { along: number | undefined; across: number | undefined }
export interface ApproachForm {
  vInfKmS: number | undefined
  raDeg: number | undefined
  decDeg: number | undefined
  timeUtc: string
  /** The true impact point, degrees east and north. */
  lon: number | undefined
  lat: number | undefined
  lineAngleDeg: number | undefined
  samples: number | undefined
  sigmas: ApproachSigma[]
}

/** The default series for solution i of n: wide to narrow, a factor of five a step. */
export function defaultSigma(i: number): { along: number; across: number } {
  const f = 0.2 ** i
  return { along: Math.round(60_000 * f), across: Math.round(3000 * f) }
}

/** A radiant some 35° east and 10° south of the zenith of the point at the time: a moderate, reachable entry. */
export function suggestRadiant(timeUtc: string, lon: number, lat: number): { raDeg: number; decDeg: number } {
  const ra = (((greenwichSiderealDeg(timeUtc) + lon + 35) % 360) + 360) % 360
  return { raDeg: Number(ra.toFixed(2)), decDeg: Math.max(-89, Math.min(89, lat - 10)) }
}

/** The form as the scenario's solutions give it: their encounters where they have them, else defaults. */
export function approachFormOf(doc: Scenario): ApproachForm {
  const withEncounter = doc.solutions.find(s => s.encounter)
  const e = withEncounter?.encounter
  const timeUtc = e?.timeUtc ?? doc.clock.impactTime
  let point: [number, number] = doc.solutions.at(-1)?.solution.corridor.nominal ?? [0, 0]
  if (e) {
    const entry = entryFromBPlane({ ...e, xiKm: e.nominal.xiKm, zetaKm: e.nominal.zetaKm })
    if (entry.hit && entry.lon !== null && entry.lat !== null) point = [Number(entry.lon.toFixed(4)), Number(entry.lat.toFixed(4))]
  }
  const radiant = e?.radiant ?? suggestRadiant(timeUtc, point[0], point[1])
  return {
    vInfKmS: e?.vInfKmS ?? 15, raDeg: radiant.raDeg, decDeg: radiant.decDeg, timeUtc, lon: point[0], lat: point[1],
    lineAngleDeg: e?.lineAngleDeg ?? 20, samples: e?.samples ?? 20_000,
    sigmas: doc.solutions.map((s, i) =>
      (s.encounter ? { along: s.encounter.sigmaAlongKm, across: s.encounter.sigmaAcrossKm } : defaultSigma(i))),
  }
}

/** The b-plane point that hits the true impact point, or null (missing inputs, or not reachable from that radiant). */
export function approachNominal(f: ApproachForm): BPlanePoint | null {
  if ([f.vInfKmS, f.raDeg, f.decDeg, f.lon, f.lat].some(v => v === undefined || !Number.isFinite(v))) return null
  if (!(f.vInfKmS! >= 1) || Number.isNaN(Date.parse(f.timeUtc))) return null
  const radiant = { raDeg: f.raDeg!, decDeg: f.decDeg! }
  const p = findBPlanePoint({ vInfKmS: f.vInfKmS!, radiant, timeUtc: f.timeUtc, target: [f.lon!, f.lat!] })
  return p && { xiKm: Number(p.xiKm.toFixed(3)), zetaKm: Number(p.zetaKm.toFixed(3)) }
}

/** The encounter of solution i, or null while the form is incomplete or out of range. */
export function approachEncounter(f: ApproachForm, nominal: BPlanePoint | null, i: number): ScenarioEncounter | null {
  const sigma = f.sigmas[i] ?? defaultSigma(i)
  if (!nominal) return null
  const candidate = {
    vInfKmS: f.vInfKmS, radiant: { raDeg: f.raDeg, decDeg: f.decDeg }, timeUtc: f.timeUtc, nominal,
    sigmaAlongKm: sigma.along, sigmaAcrossKm: sigma.across, lineAngleDeg: f.lineAngleDeg, samples: f.samples, seed: i + 1,
  }
  const r = encounterSchema.safeParse(candidate)
  return r.success ? r.data : null
}
