import { describe, expect, it } from 'vitest'
import { assessSolution, orbitSolutionSchema, thermalRadiusM, THRESHOLDS } from '../../../shared/hazard/index'
import { DRILL_MARKING } from '../../../shared/utils/drill'
import { blastRings, hasFootprints, mapOverlays, medianBlastCase, nominalContours } from '../../../shared/geo/overlays'
import { buildScene } from '../../../shared/geo/scene'
import { renderMapSvg } from '../../../shared/geo/svg'
import { NARROW, SITES, surfaceAssessment } from './fixtures'

// A 160 m class body on the demo's last, narrow corridor (fictional), assessed by the engine with footprints.
const solution = orbitSolutionSchema.parse({
  epoch: '2031-05-01T00:00:00Z', impactTime: '2034-09-14T03:12:00Z', impactProbability: 1,
  magnitude: { H: 21.9, sigma: 0.2 }, taxonomicClass: 'S', entrySpeedKmS: { mean: 18, sigma: 1 },
  corridor: { path: NARROW.path, halfWidthKm: 8, nominal: NARROW.nominal, alongTrackSigmaKm: 15 }, waterDepthM: 2000,
})
const a = assessSolution(solution, [], { samples: 4000, seed: 1 })
const corridors = [{ ...NARROW, halfWidthKm: 8 }]

describe('footprints on the map', () => {
  it('shows the chosen footprints with their median-case contours; an older assessment gets the labelled rings', () => {
    expect(hasFootprints(a)).toBe(true)
    const o = mapOverlays(a, ['houseCollapse', 'burn2'])
    expect(o.footprints!.map(f => f.key)).toEqual(['houseCollapse', 'burn2'])
    expect(o.rings.map(r => r.key)).toEqual(['houseCollapse', 'burn2'])
    // The blast line is the ring of the median case; the burn line inverts the engine's heat law for the same case.
    expect(o.rings[0]!.radiusKm).toBe(blastRings(a, ['houseCollapse']).rings[0]!.radiusKm)
    const b = medianBlastCase(a)
    const burn = THRESHOLDS.find(t => t.key === 'burn2')!.value
    const want = thermalRadiusM({ energyMt: b.energyMt, burstAltitudeM: b.burstAltitudeM, airEnergyMt: a.airEnergyMt!.p50 }, burn) / 1000
    expect(o.rings[1]!.radiusKm).toBeCloseTo(want, 9)
    expect(nominalContours(a).contours.map(c => c.key)).toEqual(['windows', 'houseCollapse', 'multistoreyCollapse', 'burn2'])

    const old = surfaceAssessment()
    expect(hasFootprints(old)).toBe(false)
    const fallback = mapOverlays(old, ['burn2'])
    expect(fallback.footprints).toBeUndefined()
    expect(fallback.rings.map(r => r.key)).toEqual(['windows', 'houseCollapse', 'multistoreyCollapse'])
  })

  it('draws each level as a path, the contour unlabelled, and one label at the top of the even-odds area', () => {
    const o = mapOverlays(a, ['windows'])
    const scene = buildScene({ width: 900, height: 600, view: 'regional', corridors, impactPoints: a.impactPoints, rings: o.rings, footprints: o.footprints })
    expect(scene.probabilistic).toBe(true)
    const f = scene.footprints[0]!
    expect(f.levels.map(l => l.probability)).toEqual([0.1, 0.5, 0.9])
    for (const l of f.levels) expect(l.d).toMatch(/^M[\d.-]+,[\d.-]+/)
    expect(scene.rings.every(r => r.labelAt === null)).toBe(true)
    expect(f.labelAt).not.toBeNull()
    // The label sits on the even-odds area's northern edge, inside the frame (the view fits the weakest area).
    const mid = a.footprints!.find(x => x.key === 'windows')!.levels[1]!.geometry
    const top = Math.max(...mid.coordinates.flatMap(p => p[0]!.map(q => q[1]!)))
    const xy = scene.projection([0, top])!
    expect(Math.abs(f.labelAt![1] - xy[1])).toBeLessThan(1)
    const rings = buildScene({ width: 900, height: 600, view: 'regional', corridors, rings: blastRings(a).rings })
    expect(rings.probabilistic).toBe(false)
    expect(rings.rings.some(r => r.labelAt !== null)).toBe(true)
  })

  it('renders the footprint, its line and the legend in our words in the SVG (report and download), with the marking', () => {
    const o = mapOverlays(a, ['windows'])
    const svg = renderMapSvg({
      width: 1000, height: 640, view: 'regional', corridors, impactPoints: a.impactPoints, sites: SITES,
      rings: o.rings, footprints: o.footprints, ringBasis: o.basis,
    })
    for (const p of [0.1, 0.5, 0.9]) expect(svg).toMatch(new RegExp(`class="footprint" data-footprint="windows" data-probability="${p}" d="M`))
    expect(svg).toContain('class="nominal-line" data-nominal="windows"')
    expect(svg).toContain('>Windows shatter</text>')
    expect(svg).not.toContain('class="ring"')
    expect(svg).not.toContain('ring-label')
    // The legend's note is wrapped over several lines of text.
    const words = svg.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ')
    expect(words).toContain('Shading: the chance, if it strikes, that windows shatter there — faintest 1 in 10, then 1 in 2, strongest 9 in 10')
    expect(words).toContain(`from ${a.impactPoints.length.toLocaleString('en-GB')} sampled impacts`)
    expect(words).toContain('Thin line: the same threshold for the middle case')
    expect(svg).toContain(DRILL_MARKING)
    const dark = renderMapSvg({ width: 800, height: 500, view: 'regional', corridors, theme: 'dark', rings: o.rings, footprints: o.footprints })
    expect(dark).toContain('fill="#9f2339" fill-opacity="0.32"')
  })
})
