import { describe, expect, it } from 'vitest'
import { DRILL_MARKING } from '../../../shared/utils/drill'
import { blastRings } from '../../../shared/geo/overlays'
import { buildScene, pointsPath } from '../../../shared/geo/scene'
import { renderMapSvg } from '../../../shared/geo/svg'
import { loadAtlas } from '../../../shared/geo/atlas'
import { placeLabels } from '../../../shared/geo/labels'
import { NARROW, SITES, WIDE, surfaceAssessment } from './fixtures'

describe('renderMapSvg', () => {
  const a = surfaceAssessment()
  const { basis, rings } = blastRings(a)
  const options = {
    width: 900,
    height: 600,
    view: 'regional' as const,
    corridors: [WIDE, NARROW],
    impactPoints: a.impactPoints,
    sites: SITES,
    rings,
    ringBasis: basis,
  }

  it('outlines protective-action zones by kind and names them', () => {
    const nominal = NARROW.nominal
    const svg = renderMapSvg({ ...options, zones: [
      { kind: 'evacuate', name: 'Harbour & beach', shape: { type: 'circle', centre: nominal, radiusKm: 20 } },
      { kind: 'exclusion', name: 'Sea area', shape: { type: 'polygon', ring: [[nominal[0] - 0.5, nominal[1] - 0.3], [nominal[0] + 0.5, nominal[1] - 0.3], [nominal[0], nominal[1] + 0.4]] } },
    ] })
    expect(svg).toMatch(/<path class="zone" data-zone="evacuate" d="M[^"]+Z"/)
    expect(svg).toMatch(/<path class="zone" data-zone="exclusion" d="M[^"]+Z"[^>]*stroke-dasharray="2 3"/)
    expect(svg).toContain('Evacuate: Harbour &amp; beach')
    expect(svg).toContain('Keep out: Sea area')
    expect(renderMapSvg(options)).not.toContain('class="zone"')
  })

  it('draws the current and earlier corridors as paths, the marking and the sites by name', async () => {
    const svg = renderMapSvg({ ...options, atlas: await loadAtlas('50m') })
    expect(svg.startsWith('<svg')).toBe(true)
    expect(svg).toMatch(/<path class="corridor corridor-current" data-corridor="current" d="M[^"]+"/)
    expect(svg).toMatch(/data-corridor="earlier" d="M[^"]+"/)
    expect(svg).toContain(DRILL_MARKING)
    expect(svg).toContain('class="land"')
    for (const s of SITES) expect(svg).toContain(`>${s.name}</text>`)
    expect(svg).toContain('data-ring="windows"')
    expect(svg).toContain('Blast rings: median case')
    expect(svg).toMatch(/kPa \(\d\.\d psi\)/)
  })

  it('escapes text and renders in the dark theme without an atlas', () => {
    const svg = renderMapSvg({ ...options, theme: 'dark', title: 'A <b> & "c"', sites: [{ ...SITES[0]!, name: 'Foz & <Mar>' }] })
    expect(svg).toContain('Foz &amp; &lt;Mar&gt;')
    expect(svg).toContain('A &lt;b&gt; &amp; &quot;c&quot;')
    expect(svg).toContain('#0b293c')
    expect(svg).not.toContain('class="land"')
  })

  it('culls impact points outside the view', () => {
    const scene = buildScene({ ...options })
    // Two points off the coast are in view; the one in the southern Indian Ocean is not.
    expect(scene.points).toHaveLength(2)
    expect(scene.culledPoints).toBe(1)
    for (const p of scene.points) {
      expect(p.x).toBeGreaterThanOrEqual(0)
      expect(p.x).toBeLessThanOrEqual(900)
      expect(p.y).toBeGreaterThanOrEqual(0)
      expect(p.y).toBeLessThanOrEqual(600)
    }
    expect(pointsPath(scene.points, 'sea').match(/M/g)).toHaveLength(2)
    expect(pointsPath(scene.points, 'land')).toBe('')
  })

  it('fits the ocean view to the earliest wide corridor and the regional view to the rings and sites', () => {
    const ocean = buildScene({ ...options, view: 'ocean' })
    const regional = buildScene({ ...options })
    const spanX = (s: typeof ocean) => {
      const a = s.projection([-30, 35])!, b = s.projection([-20, 35])!
      return Math.abs(b[0] - a[0])
    }
    // Ten degrees of longitude take a small part of the ocean view and far more than the regional frame.
    expect(spanX(ocean)).toBeLessThan(300)
    expect(spanX(regional)).toBeGreaterThan(900)
    for (const s of regional.sites) {
      expect(s.x).toBeGreaterThan(0)
      expect(s.y).toBeLessThan(600)
    }
    expect(regional.sites).toHaveLength(SITES.length)
  })
})

describe('placeLabels', () => {
  it('moves a label aside instead of overprinting, and drops one that fits nowhere', () => {
    const placed = placeLabels([
      { id: 'a', x: 100, y: 100, text: 'Alpha' },
      { id: 'b', x: 100, y: 112, text: 'Bravo' },
      { id: 'c', x: 4, y: 4, text: 'Charlie is a long name' },
    ], { width: 200, height: 200, fontPx: 12, markerPx: 5 })
    expect(placed.get('a')).toMatchObject({ anchor: 'start' })
    expect(placed.get('b')?.anchor).not.toBe(undefined)
    expect(placed.get('b')).not.toEqual(placed.get('a'))
    expect(placed.get('c')).toBeNull()
  })
})
