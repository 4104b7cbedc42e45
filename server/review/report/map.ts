import { defaultView, loadAtlas, mapOverlays, renderMapSvg, runUpClass } from '#shared/geo'
import type { OrbitSolution, Site } from '#shared/hazard/schema'
import type { Assessment } from '#shared/hazard/types'
import type { ZoneKind, ZoneShape } from '#shared/geo/zones'

/** What the report's map is drawn from: the sites and the published solutions with their assessments, in order. */
export interface MapSource {
  sites: Site[]
  published: Array<{ solution: OrbitSolution; assessment: Assessment }>
  /** Protective-action zones in force at the end of the drill. */
  zones?: Array<{ kind: ZoneKind; name: string; shape: ZoneShape }>
}

/**
 * The corridor map of the last published solution with the earlier corridors, as an SVG string (Plex fonts for the PDF):
 * the default footprint with its median-case line, or the blast rings for an assessment without footprints.
 */
export async function finalMapSvg(
  { sites, published, zones }: MapSource,
  opts: { width?: number; height?: number; fontFamily?: string } = {},
) {
  const last = published.at(-1)
  if (!last) return null
  const { basis, rings, footprints } = mapOverlays(last.assessment)
  const view = defaultView(last.solution.corridor)
  return renderMapSvg({
    width: opts.width ?? 1000, height: opts.height ?? 580, view, atlas: await loadAtlas(view === 'regional' ? '50m' : '110m'),
    corridors: published.map(p => p.solution.corridor), impactPoints: last.assessment.impactPoints, rings, ringBasis: basis, footprints,
    zones,
    sites: sites.flatMap((s) => {
      const a = last.assessment.sites.find(x => x.siteId === s.id)
      return a ? [{ id: s.id, name: s.name, lon: s.lon, lat: s.lat, population: s.population, tone: runUpClass(a) }] : []
    }),
    title: 'Risk corridor of the last published solution, earlier corridors dashed', fontFamily: opts.fontFamily,
  })
}
