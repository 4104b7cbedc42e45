/**
 * Damage reach and probabilistic footprints (see shared/hazard/README.md, "Footprints").
 *
 * Reach: for one realisation, the ground radius within which a threshold is exceeded, found by bisection on the
 * same law, source energy and source height as the site loop (sites.ts) uses, so that a site at great-circle
 * distance d from the realisation's impact point exceeds the threshold exactly when d < radius (to the rounding).
 *
 * Footprint: the share of realisations whose reach disc covers a place, on a lon/lat grid, contoured with marching
 * squares (d3-contour) at 1 in 10, 1 in 2 and 9 in 10.
 */
import { contours } from 'd3-contour'
import type { MultiPolygon, Position } from 'geojson'
import { REC, type SampleSet } from './sample'
import { BLAST } from './blast'
import { visibleFractionOfRatio } from './thermal'
import { FOOTPRINT_KEYS, THRESHOLDS, type DamageReach, type Footprint, type FootprintLevel, type ThresholdKey } from './types'
import { DEG, EARTH_RADIUS_M } from './units'

/** Probability levels of the footprints: 1 in 10, 1 in 2, 9 in 10 (conditional on impact). */
export const FOOTPRINT_LEVELS = [0.1, 0.5, 0.9] as const
/** Grid cells along the longer side of the footprint grid (before the one-cell margin on each side). */
export const FOOTPRINT_GRID_CELLS = 100

const LN_RX = Math.log(BLAST.crossoverRangeM)
const PXRX4 = BLAST.crossoverPressurePa * BLAST.crossoverRangeM / 4
const O_S = REC.s, O_LNS = REC.lnS, O_Z1 = REC.z1, O_RM = REC.rm, O_P0 = REC.p0, O_BETA = REC.beta, O_ALT = REC.alt
const O_THK = REC.thK, O_ZB = REC.zb, O_RF = REC.rf, O_BURN = REC.burn
const R_E = EARTH_RADIUS_M
/** Farthest ground range considered: half the Earth's circumference, m. */
const MAX_RANGE_M = Math.PI * R_E

/**
 * Peak ground overpressure of the realisation at record offset o and ground range r (m), Pa: the site loop's law
 * (sites.ts, blast.ts `overpressurePa`) term by term.
 */
function overpressureAt(R: Float64Array, o: number, r: number): number {
  const s = R[o + O_S]!
  if (!(s > 0)) return 0
  const zs = R[o + O_ZB]!
  const rm = R[o + O_RM]!
  let x = r > rm ? r : rm
  if (zs > 0) { const sl = Math.sqrt(r * r + zs * zs); if (sl < x) x = sl }
  let p = PXRX4 * s / x * (1 + 3 * Math.exp(1.3 * (LN_RX + R[o + O_LNS]! - Math.log(x))))
  if (R[o + O_Z1]! > 0) { const pr = R[o + O_P0]! * Math.exp(-R[o + O_BETA]! * r); if (pr > p) p = pr }
  return p * R[o + O_ALT]!
}

/**
 * Thermal exposure of the realisation at ground range r (m) relative to its burn scaling, i.e. the site loop's
 * `phi E_Mt^(-1/6)` (J/m² at 1 Mt), compared there with the burn levels of THRESHOLDS. Non-increasing with range:
 * the hidden height (1 - cos(r/R_E)) R_E - z grows with r, the visible fraction falls with it, and 1/(r² + z²) falls.
 */
function burnExposureAt(R: Float64Array, o: number, r: number): number {
  const K = R[o + O_THK]!
  if (!(K > 0)) return 0
  const zb = R[o + O_ZB]!
  const hidden = (1 - Math.cos(r / R_E)) * R_E - zb
  const rf = R[o + O_RF]!
  if (!(hidden < rf)) return 0
  return visibleFractionOfRatio(hidden / rf) * K / (r * r + zb * zb) * R[o + O_BURN]!
}

/**
 * Largest ground range r (m, in [1 m, half the circumference]) at which f(r) >= threshold, for f non-increasing in
 * r; 0 when even 1 m does not reach it (the site loop puts sites closer than 1 m at 1 m). Keeps a bracket
 * [lo, hi] (f(lo) >= threshold > f(hi)) and shrinks it to 0.5 m: regula falsi on log f against log r (Illinois
 * variant; bisection while f(hi) is 0), one probe while the bracket is wide and a pair 0.5 m apart around the
 * estimate once it is narrow. `upper` is a known upper bound or 0; `guess` an estimate or 0 (a pair 0.1 % either
 * side of it is probed first).
 */
function reachM(f: (r: number) => number, threshold: number, upper: number, guess: number): number {
  const f1 = f(1)
  if (!(f1 >= threshold)) return 0
  let hi = upper > 1 ? Math.min(upper * 1.000001 + 1, MAX_RANGE_M) : MAX_RANGE_M
  let fhi = f(hi)
  if (fhi >= threshold) {
    if (hi >= MAX_RANGE_M) return MAX_RANGE_M
    hi = MAX_RANGE_M
    fhi = f(hi)
    if (fhi >= threshold) return MAX_RANGE_M
  }
  const lt = Math.log(threshold)
  let lo = 1
  let llo = 0, lhi = Math.log(hi)
  let glo = Math.log(f1) - lt, ghi = fhi > 0 ? Math.log(fhi) - lt : -Infinity
  // Which end moved last (1: lo, -1: hi): a second move of the same end halves the other end's value (Illinois).
  let last = 0
  const probe = (r: number) => {
    if (!(r > lo && r < hi)) return
    const fr = f(r)
    if (fr >= threshold) {
      lo = r; llo = Math.log(r); glo = Math.log(fr) - lt
      if (last === 1) ghi *= 0.5
      last = 1
    }
    else {
      hi = r; lhi = Math.log(r); ghi = fr > 0 ? Math.log(fr) - lt : -Infinity
      if (last === -1) glo *= 0.5
      last = -1
    }
  }
  if (guess > 1) { probe(guess * 0.999); probe(guess * 1.001) }
  for (let k = 0; k < 200 && hi - lo > 0.5; k++) {
    let lm = Number.isFinite(ghi) ? llo + (lhi - llo) * glo / (glo - ghi) : 0.5 * (llo + lhi)
    const w = lhi - llo
    if (!(lm > llo + 1e-9 * w && lm < lhi - 1e-9 * w)) lm = 0.5 * (llo + lhi)
    const m = Math.exp(lm)
    if (hi - lo < 1e-3 * hi) { probe(m - 0.25); probe(m + 0.25) }
    else probe(m)
  }
  return lo
}

/**
 * An upper bound of the burn reach: the range at which the exposure would fall to the level with the whole
 * fireball in view, `r² + z² = K E_Mt^(-1/6) / level` (the visible fraction is at most 1); 0 when none.
 */
function burnBoundM(R: Float64Array, o: number, level: number): number {
  const zb = R[o + O_ZB]!
  const r2 = R[o + O_THK]! * R[o + O_BURN]! / level - zb * zb
  return r2 > 1 ? Math.sqrt(r2) : 0
}

/** Threshold value of each footprint key in the units the site loop compares (Pa; burn: J/m² at 1 Mt). */
const FOOTPRINT_THRESHOLDS = FOOTPRINT_KEYS.map((key) => {
  const t = THRESHOLDS.find(x => x.key === key)!
  return { key, value: t.value, thermal: t.kind === 'thermal' }
})

/**
 * The reach of each footprint threshold for the realisations `indices` of S (the thinned map points), km, rounded
 * to 0.01 km. Overpressure thresholds are done from the weakest up, each bounding the next.
 */
export function damageReach(S: SampleSet, indices: ArrayLike<number>): DamageReach {
  const R = S.rec
  const keys = FOOTPRINT_THRESHOLDS.map(t => t.key)
  const radiiKm: number[][] = []
  // Weakest overpressure first, so each radius bounds the next (the law is the same, the level higher).
  const order = FOOTPRINT_THRESHOLDS.map((t, j) => ({ t, j }))
    .sort((a, b) => Number(a.t.thermal) - Number(b.t.thermal) || a.t.value - b.t.value)
  // The previous realisation's radius of each key and its scale (E^(1/3) for blast, the burn bound for heat): the
  // first guess for the next realisation, scaled.
  const prevM = new Float64Array(keys.length), prevScale = new Float64Array(keys.length)
  let o = 0
  const pressure = (r: number) => overpressureAt(R, o, r)
  const burn = (r: number) => burnExposureAt(R, o, r)
  for (let k = 0; k < indices.length; k++) {
    o = REC.size * indices[k]!
    const row = Array.from({ length: keys.length }, () => 0)
    let bound = 0
    for (const { t, j } of order) {
      const upper = t.thermal ? burnBoundM(R, o, t.value) : bound
      const scale = t.thermal ? upper : R[o + O_S]!
      const guess = prevM[j]! > 0 && prevScale[j]! > 0 ? prevM[j]! * scale / prevScale[j]! : 0
      const m = reachM(t.thermal ? burn : pressure, t.value, upper, guess)
      if (!t.thermal) bound = m
      prevM[j] = m
      prevScale[j] = scale
      row[j] = Math.round(m / 10) / 100
    }
    radiiKm.push(row)
  }
  return { keys, radiiKm }
}

/** Wraps a longitude difference into (-180, 180]. */
function wrap180(d: number): number {
  const x = ((d + 180) % 360 + 360) % 360 - 180
  return x === -180 ? 180 : x
}

const round4 = (x: number) => Math.round(x * 1e4) / 1e4

/**
 * Footprints from the thinned impact points and their reach: for each key, the share P of realisations whose disc
 * (great-circle distance to the point below its radius) covers each node of a lon/lat grid that covers every disc
 * (about FOOTPRINT_GRID_CELLS cells along the longer side, square in km at the middle latitude), contoured at
 * FOOTPRINT_LEVELS (d3-contour, linear interpolation between nodes) and returned as lon/lat MultiPolygons rounded
 * to 1e-4° (exterior rings clockwise, holes counter-clockwise, as d3-geo reads them). Levels without area are
 * left out; a key that no realisation reaches has no levels. All keys share one grid, so a stronger threshold's
 * area lies inside a weaker one's when every realisation's radii are ordered.
 */
export function damageFootprints(points: ReadonlyArray<readonly [number, number, number]>, reach: DamageReach): Footprint[] {
  const n = points.length
  const keys = reach.keys
  const empty = keys.map(key => ({ key, label: labelOf(key), levels: [] as FootprintLevel[] }))
  if (n === 0) return empty
  // Longitudes unwrapped around the first point, so that a corridor across the antimeridian stays in one piece.
  const ref = points[0]![0]
  const lonU = new Float64Array(n), latR = new Float64Array(n)
  let lonMin = Infinity, lonMax = -Infinity, latMin = Infinity, latMax = -Infinity, pole = false
  for (let i = 0; i < n; i++) {
    const [lon, lat] = points[i]!
    lonU[i] = ref + wrap180(lon - ref)
    latR[i] = lat * DEG
    let rMax = 0
    for (const r of reach.radiiKm[i]!) if (r > rMax) rMax = r
    if (!(rMax > 0)) continue
    const rho = rMax * 1000 / R_E / DEG
    latMin = Math.min(latMin, lat - rho)
    latMax = Math.max(latMax, lat + rho)
    const c = Math.cos(lat * DEG)
    if (lat + rho >= 90 || lat - rho <= -90 || Math.sin(rho * DEG) >= c) { pole = true; continue }
    const dLon = Math.asin(Math.sin(rho * DEG) / c) / DEG
    lonMin = Math.min(lonMin, lonU[i]! - dLon)
    lonMax = Math.max(lonMax, lonU[i]! + dLon)
  }
  if (!(latMax > latMin)) return empty
  latMin = Math.max(latMin, -89.99)
  latMax = Math.min(latMax, 89.99)
  if (pole || !(lonMax > lonMin) || lonMax - lonMin > 360) { lonMin = ref - 180; lonMax = ref + 180 }
  // Cells square in km at the middle latitude (the cosine floored for grids near a pole).
  const kx = Math.max(0.05, Math.cos(0.5 * (latMin + latMax) * DEG))
  const step = Math.max((lonMax - lonMin) * kx, latMax - latMin) / FOOTPRINT_GRID_CELLS
  const dLat = step, dLon = step / kx
  const nx = Math.ceil((lonMax - lonMin) / dLon) + 3, ny = Math.ceil((latMax - latMin) / dLat) + 3
  const lonA = lonMin - dLon, latA = latMin - dLat
  const rowLat = Float64Array.from({ length: ny }, (_, y) => (latA + y * dLat) * DEG)
  const rowSin = rowLat.map(Math.sin), rowCos = rowLat.map(Math.cos)
  const diff = new Float64Array((nx + 1) * ny)
  const values = new Float64Array(nx * ny)
  const gen = contours().size([nx, ny]).thresholds([...FOOTPRINT_LEVELS])
  return keys.map((key, j) => {
    diff.fill(0)
    let any = false
    for (let i = 0; i < n; i++) {
      const rKm = reach.radiiKm[i]![j]!
      if (!(rKm > 0)) continue
      any = true
      const rho = rKm * 1000 / R_E
      const cosRho = Math.cos(rho)
      const sinP = Math.sin(latR[i]!), cosP = Math.cos(latR[i]!)
      const rhoDeg = rho / DEG, latDeg = latR[i]! / DEG
      const y0 = Math.max(0, Math.ceil((latDeg - rhoDeg - latA) / dLat)), y1 = Math.min(ny - 1, Math.floor((latDeg + rhoDeg - latA) / dLat))
      for (let y = y0; y <= y1; y++) {
        // Nodes of this row within the disc: cos d = sin φ sin φi + cos φ cos φi cos Δλ > cos ρ.
        const den = rowCos[y]! * cosP
        const q = den > 0 ? (cosRho - rowSin[y]! * sinP) / den : Infinity
        let x0: number, x1: number
        if (q < -1) { x0 = 0; x1 = nx - 1 }
        else if (q >= 1) continue
        else {
          const half = Math.acos(q) / DEG
          x0 = Math.max(0, Math.ceil((lonU[i]! - half - lonA) / dLon))
          x1 = Math.min(nx - 1, Math.floor((lonU[i]! + half - lonA) / dLon))
          if (x0 > x1) continue
        }
        const b = y * (nx + 1)
        diff[b + x0]! += 1
        diff[b + x1 + 1]! -= 1
      }
    }
    if (!any) return { key, label: labelOf(key), levels: [] }
    for (let y = 0; y < ny; y++) {
      let acc = 0
      const b = y * (nx + 1)
      for (let x = 0; x < nx; x++) { acc += diff[b + x]!; values[y * nx + x] = acc / n }
    }
    const levels: FootprintLevel[] = []
    for (const c of gen(values as unknown as number[])) {
      const geometry = toLonLat(c.coordinates, lonA, latA, dLon, dLat)
      if (geometry.coordinates.length) levels.push({ probability: c.value, geometry })
    }
    return { key, label: labelOf(key), levels }
  })
}

function labelOf(key: ThresholdKey): string {
  return THRESHOLDS.find(t => t.key === key)?.label ?? key
}

/** Twice the signed area of a ring in the lon/lat plane (positive: counter-clockwise with north up). */
function signedArea(ring: Position[]): number {
  let a = 0
  for (let k = 0, m = ring.length - 1; k < ring.length; m = k++) a += (ring[m]![0]! - ring[k]![0]!) * (ring[m]![1]! + ring[k]![1]!)
  return a
}

/**
 * Grid polygons of d3-contour (node (x, y) at (x + 0.5, y + 0.5)) to lon/lat, rounded to 1e-4°, repeated vertices
 * dropped, exterior rings clockwise and holes counter-clockwise (d3-geo's spherical winding).
 */
function toLonLat(polys: Position[][][], lonA: number, latA: number, dLon: number, dLat: number): MultiPolygon {
  const out: Position[][][] = []
  for (const poly of polys) {
    const rings: Position[][] = []
    poly.forEach((ring, k) => {
      const r: Position[] = []
      for (const [x, y] of ring) {
        const p = [round4(lonA + (x! - 0.5) * dLon), round4(latA + (y! - 0.5) * dLat)]
        const last = r[r.length - 1]
        if (!last || last[0] !== p[0] || last[1] !== p[1]) r.push(p)
      }
      if (r.length > 1 && (r[0]![0] !== r[r.length - 1]![0] || r[0]![1] !== r[r.length - 1]![1])) r.push([...r[0]!])
      if (r.length < 4) return
      const a = signedArea(r)
      if (a === 0) return
      if ((k === 0) === (a > 0)) r.reverse()
      rings.push(r)
    })
    // A polygon whose exterior ring collapsed under the rounding is dropped with its holes.
    if (rings.length && poly[0] && rings[0] && signedArea(rings[0]) < 0) out.push(rings)
  }
  return { type: 'MultiPolygon', coordinates: out }
}
