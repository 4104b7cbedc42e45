import { describe, expect, it } from 'vitest'
import { overpressurePa } from '../../../shared/hazard/blast'
import { tsunamiAmplitudeAtM } from '../../../shared/hazard/ocean'
import { logSpace, overpressureCurve, tsunamiCurve } from '../../../shared/geo/curves'
import { kmRangeText, kmText, kPaRangeText, kPaText, medianRangeText, probabilityText, rangeText } from '../../../shared/geo/figures'
import { runUpClass } from '../../../shared/geo/overlays'
import { defaultView } from '../../../shared/geo/views'
import { NARROW, WIDE } from './fixtures'

describe('figures as text', () => {
  it.each([
    [() => rangeText({ p5: 144.7, p50: 193.5, p95: 256.3 }, 'Mt TNT'), '140–260 Mt TNT'],
    [() => medianRangeText({ p5: 144.7, p50: 193.5, p95: 256.3 }, 'Mt TNT'), '190 Mt TNT (5–95 %: 140–260)'],
    [() => rangeText({ p5: 2, p50: 2, p95: 2 }, 'km'), '2 km'],
    // 1 nautical mile = 1.852 km; 1 psi = 6.894757 kPa (common practice, no source).
    [() => kmText(59), '59 km (32 nmi)'],
    [() => kmRangeText({ p5: 52.2, p50: 54.6, p95: 57 }), '52–57 km (28–31 nmi)'],
    [() => kPaText(6.9), '6.9 kPa (1.0 psi)'],
    [() => kPaText(26.8), '27 kPa (3.9 psi)'],
    [() => kPaRangeText({ p5: 5.5, p50: 6.1, p95: 6.8 }), '5.5–6.8 kPa (0.8–0.99 psi)'],
    [() => probabilityText(0.027), '2.7 % (1 in 37)'],
    [() => probabilityText(0.62), '62 %'],
    [() => probabilityText(1), '100 %'],
  ])('formats %#', (f, expected) => {
    expect(f()).toBe(expected)
  })
})

describe('median-case curves', () => {
  it('spaces distances evenly on a log scale', () => {
    const d = logSpace(1, 100, 3)
    expect(d[0]).toBeCloseTo(1, 12)
    expect(d[1]).toBeCloseTo(10, 12)
    expect(d[2]).toBeCloseTo(100, 12)
  })

  it('uses the engine laws unchanged (overpressurePa, tsunamiAmplitudeAtM)', () => {
    const basis = { energyMt: 130, burstAltitudeM: 0, regime: 'surface' as const }
    for (const [km, kPa] of overpressureCurve(basis, 1, 300, 9)) {
      expect(kPa).toBeCloseTo(overpressurePa({ energyMt: 130, groundRangeM: km * 1000, burstAltitudeM: 0 }) / 1000, 9)
    }
    for (const [km, m] of tsunamiCurve(2855, 450, 1, 500, 9)) {
      expect(m).toBeCloseTo(tsunamiAmplitudeAtM({ cavityDiameterM: 2855, waterDepthM: 450, distanceM: km * 1000 }), 9)
    }
  })

  it('falls with distance', () => {
    const c = overpressureCurve({ energyMt: 10, burstAltitudeM: 0, regime: 'surface' }, 1, 100, 20)
    for (let i = 1; i < c.length; i++) expect(c[i]![1]).toBeLessThan(c[i - 1]![1])
  })
})

describe('map choices', () => {
  it('shows a wide corridor in the ocean view and a narrow one in the regional view', () => {
    expect(defaultView(WIDE)).toBe('ocean')
    expect(defaultView(NARROW)).toBe('regional')
  })

  it.each([
    [{ coastal: false, runUpM: { p5: 0, p50: 0, p95: 0 } }, 'inland'],
    [{ coastal: true, runUpM: { p5: 0, p50: 0, p95: 0 } }, 'none'],
    [{ coastal: true, runUpM: { p5: 0.1, p50: 0.3, p95: 0.9 } }, 'low'],
    [{ coastal: true, runUpM: { p5: 0.5, p50: 1.2, p95: 2.9 } }, 'moderate'],
    [{ coastal: true, runUpM: { p5: 2, p50: 5, p95: 9 } }, 'high'],
  ] as const)('marks a site by its 95th-percentile run-up (%#)', (site, tone) => {
    expect(runUpClass(site)).toBe(tone)
  })
})
