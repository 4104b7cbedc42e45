import { describe, expect, it } from 'vitest'
import { assessmentHeadline } from '../../../shared/live/headline'
import type { Percentiles } from '../../../shared/hazard/types'
import { surfaceAssessment } from '../geo/fixtures'

const p = (p5: number, p50: number, p95: number): Percentiles => ({ p5, p50, p95 })

describe('the headline of a publication', () => {
  it('names the worst run-up with each source law\'s median when the model gives the band', () => {
    const a = surfaceAssessment()
    const [near] = a.sites
    a.sites.push({ ...near!, siteId: 'far', name: 'Far Cove', runUpM: p(1, 2, 3), tsunamiBand: undefined })
    near!.tsunamiBand = {
      low: { amplitudeM: p(1, 2, 3), runUpM: p(10, 12, 14) },
      high: { amplitudeM: p(4, 6, 9), runUpM: p(20, 25, 31) },
    }
    expect(assessmentHeadline(a).worstRunUp).toEqual({ site: 'Porto Salgado', runUpM: p(12, 16, 20), lowLawM: 12, highLawM: 25 })
  })

  it('leaves the laws out for an assessment without the band, and the run-up out when no wave reaches a coast', () => {
    const a = surfaceAssessment()
    expect(assessmentHeadline(a).worstRunUp).toEqual({ site: 'Porto Salgado', runUpM: p(12, 16, 20) })
    a.sites = a.sites.map(s => ({ ...s, runUpM: p(0, 0, 0) }))
    expect(assessmentHeadline(a).worstRunUp).toBeNull()
  })

  it('carries the heat of the most exposed site and where it comes from, or none', () => {
    const a = surfaceAssessment()
    a.sites[0]!.exceedance = { ...a.sites[0]!.exceedance, burn1: 0, burn2: 0, burn3: 0 }
    expect(assessmentHeadline(a).heat).toBeNull()
    a.airburstProbability = 1
    a.sites[0]!.thermalMJM2 = p(0.1, 0.3, 0.5)
    a.sites[0]!.exceedance.burn2 = 0.4
    expect(assessmentHeadline(a).heat)
      .toEqual({ site: 'Porto Salgado', thermalMJM2: p(0.1, 0.3, 0.5), burn2: 0.4, source: 'the airburst flash' })
  })

  it('splits the energy into air and surface only when the model gives the air part', () => {
    const a = surfaceAssessment()
    expect(assessmentHeadline(a).airEnergyMt).toBeUndefined()
    a.airEnergyMt = p(100, 130, 160)
    expect(assessmentHeadline(a)).toMatchObject({ airEnergyMt: p(100, 130, 160), surfaceEnergyMt: a.surfaceEnergyMt })
  })
})
