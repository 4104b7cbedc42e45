import { describe, expect, it } from 'vitest'
import { assessSolution, siteSchema } from '../../../shared/hazard/index'
import type { Assessment, Percentiles, SiteAssessment } from '../../../shared/hazard/types'
import { bandFactor, coastRows, energyRows, heatRows, heatSourceText, heatText, threatSummary } from '../../../shared/geo/threat'
import { demoLastSolution, surfaceAssessment } from './fixtures'

const p = (p5: number, p50: number, p95: number): Percentiles => ({ p5, p50, p95 })
const band = (low: number, high: number): SiteAssessment['tsunamiBand'] => ({
  low: { amplitudeM: p(low / 4, low / 2, low), runUpM: p(low / 2, low, low * 2) },
  high: { amplitudeM: p(high / 4, high / 2, high), runUpM: p(high / 2, high, high * 2) },
})

/** The hand-made surface impact with an inland site, a far coastal one and, when asked, the band and the air energy. */
function withSites(opts: { band?: boolean; airEnergy?: boolean } = {}): Assessment {
  const a = surfaceAssessment()
  const near = a.sites[0]!
  near.exceedance = { ...near.exceedance, burn1: 0, burn2: 0, burn3: 0 }
  const far: SiteAssessment = { ...near, siteId: 'far', name: 'Far Cove', distanceKm: p(190, 200, 210), runUpM: p(0.5, 1, 2) }
  const inland: SiteAssessment = {
    ...near, siteId: 'inland', name: 'Inland', coastal: false, distanceKm: p(10, 12, 14), runUpM: p(0, 0, 0),
  }
  if (opts.band) {
    near.tsunamiBand = band(4, 20)
    far.tsunamiBand = band(0.5, 1.5)
    a.tsunamiSourceLaws = [
      { key: 'high', name: 'High law', source: 'Ward & Asphaug 2000' },
      { key: 'low', name: 'Low law', source: 'Collins et al. 2005' },
    ]
  }
  if (opts.airEnergy) a.airEnergyMt = p(1, 2, 3)
  return { ...a, sites: [far, inland, near] }
}

describe('the tsunami band in words', () => {
  it('lists coastal sites only, nearest first, with both laws when the model gives them', () => {
    const rows = coastRows(withSites({ band: true }))
    expect(rows.map(r => r.siteId)).toEqual(['porto-salgado', 'far'])
    expect(rows[0]!.band!.high.runUpM.p50).toBe(20)
    const s = threatSummary(withSites({ band: true }), 'Solution 7')
    expect(s.laws.map(l => l.key)).toEqual(['low', 'high'])
    expect(s.coast[0]!.band!.low.runUpText).toBe('4 m (2–8)')
    expect(s.coast[0]!.band!.high.runUpText).toBe('20 m (10–40)')
  })

  it('says the spread is wide and names the largest ratio of the laws at the sites', () => {
    const a = withSites({ band: true })
    expect(bandFactor(a)).toBe(5)
    expect(threatSummary(a, 'x').bandNote).toMatch(/spread between the published tsunami source laws is wide.*up to 5 times/)
  })

  it('renders an assessment of an earlier model version without the band or the air energy', () => {
    const s = threatSummary(withSites(), 'Solution 7')
    expect(s.laws).toEqual([])
    expect(s.coast.map(c => c.band)).toEqual([null, null])
    expect(s.coast[0]!.runUpText).toBe('16 m (12–20)')
    expect(s.bandNote).toContain('model test, which gives no tsunami band')
    expect(s.energies.map(e => e.key)).toEqual(['entry', 'surface'])
  })

  it('gives no coastal rows when no wave reaches any coast', () => {
    const a = withSites()
    a.sites = a.sites.map(s => ({ ...s, runUpM: p(0, 0, 0), tsunamiAmplitudeM: p(0, 0, 0) }))
    expect(coastRows(a)).toEqual([])
  })
})

describe('energy and heat in words', () => {
  it('labels the energy at entry, in the air and at the surface', () => {
    expect(energyRows(withSites({ airEnergy: true })).map(e => [e.key, e.label])).toEqual([
      ['entry', 'Energy at entry'], ['air', 'Deposited in the air'], ['surface', 'Reaching the surface'],
    ])
  })

  it.each([[0, 'the fireball'], [0.4, 'the fireball or the airburst flash'], [1, 'the airburst flash']])(
    'names the source of the heat for an airburst share of %s', (share, words) => {
      expect(heatSourceText({ airburstProbability: share })).toBe(words)
    })

  it('lists the sites that receive heat, the most exposed first, and says when none does', () => {
    const a = withSites()
    a.airburstProbability = 1
    expect(heatRows(a)).toEqual([])
    expect(heatText(a)).toBe('No site receives heat from the airburst flash in these realisations.')
    a.sites[0]!.thermalMJM2 = p(0.05, 0.1, 0.2)
    a.sites[2]!.thermalMJM2 = p(0.3, 0.6, 0.9)
    a.sites[2]!.exceedance = { ...a.sites[2]!.exceedance, burn1: 0.9, burn2: 0.6, burn3: 0.2 }
    expect(heatRows(a).map(r => r.siteId)).toEqual(['porto-salgado', 'far'])
    const s = threatSummary(a, 'x')
    expect(s.heat[0]).toMatchObject({ thermalText: '0.6 MJ/m² (0.3–0.9)', burn1: '90 %', burn3: '20 %' })
    expect(s.heatText).toMatch(/^Heat from the airburst flash reaches 2 sites/)
  })
})

describe('the summary of a real engine run', () => {
  it('carries the band of every coastal site with the low law below the high law', () => {
    // The demo scenario's last solution: a 150 m stony body off the coast.
    const solution = demoLastSolution()
    const sites = [
      siteSchema.parse({
        id: 'coast', name: 'Coast', lon: -8.83, lat: 40.14, population: 60000, offshoreDepthM: 25, beachSlopeDeg: 1.5, shelfWidthKm: 8,
      }),
      siteSchema.parse({ id: 'inland', name: 'Inland', lon: -8.78, lat: 39.7, population: 120000 }),
    ]
    const a = assessSolution(solution, sites, { samples: 2000, seed: 3 })
    const s = threatSummary(a, 'real')
    expect(s.laws).toHaveLength(2)
    expect(s.coast.map(c => c.siteId)).toEqual(['coast'])
    const row = coastRows(a)[0]!
    expect(row.band!.low.runUpM.p50).toBeLessThanOrEqual(row.band!.high.runUpM.p50)
    expect(row.band!.high.runUpM.p50).toBeGreaterThan(0)
  })
})
