import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { HAZARD_FIELDS, findHazardFields, renderHazardFields, validateHazardFields } from '../../../shared/scenario'
import { formatOdds, formatPercent, formatSignificant } from '../../../shared/scenario/format'
import { THRESHOLDS } from '../../../shared/hazard/types'
import { assessmentFixture, siteFixture } from './fixtures'

const a = assessmentFixture()

describe('renderHazardFields', () => {
  // Figures of the hand-made fixture (not engine output), each with the text it must render to.
  it.each([
    ['{{ energyMt }}', '2.1 Mt (5–95 %: 0.8–4.6 Mt)'],
    ['{{ energyMt.p50 }}', '2.1 Mt'],
    ['{{energyMt.p5}}', '0.8 Mt'],
    ['{{ energyMt.range }}', '0.8–4.6 Mt'],
    ['{{ energyMt.p50 | kt }}', '2,100 kt'],
    ['{{ energyMt | Mt }}', '2.1 Mt (5–95 %: 0.8–4.6 Mt)'],
    ['{{ impactProbability }}', '2.1 %'],
    ['{{ impactProbability | odds }}', '1 in 47'],
    ['{{ airburstProbability }}', '99.7 %'],
    ['{{ oceanImpactProbability }}', '93 %'],
    ['{{ torino }}', '3'],
    ['{{ palermo }}', '-1.23'],
    ['{{ diameterM }}', '190 m (5–95 %: 120–260 m)'],
    ['{{ diameterM.p50 | km }}', '0.19 km'],
    ['{{ massKg.p50 }}', '8.2 × 10⁹ kg'],
    ['{{ massKg.p50 | t }}', '8.2 × 10⁶ t'],
    ['{{ burstAltitudeKm }}', 'n/a (no airburst among the samples)'],
    ['{{ burstAltitudeKm.p50 }}', 'n/a (no airburst among the samples)'],
    ['{{ waterCavityDiameterM.p50 | km }}', '2.9 km'],
    ['{{ exposedPopulation.windows }}', '120,000 people'],
    ['{{ site.port-a.population }}', '61,500 people'],
    ['{{ site.port-a.name }}', 'Port A'],
    ['{{ site.port-a.runUpM.p95 }}', '4.6 m'],
    ['{{ site.port-a.runUpM }}', '2.6 m (5–95 %: 1.2–4.6 m)'],
    ['{{ site.port-a.tsunamiArrivalMin }}', '23 min (5–95 %: 18–31 min)'],
    ['{{ site.port-a.tsunamiArrivalMin.p50 | h }}', '0.39 h'],
    ['{{ site.port-a.exceedance.runUp3m }}', '41 %'],
    ['{{ site.port-a.exceedance.windows | odds }}', '1 in 5'],
    ['{{ site.port-a.seismicMagnitude }}', 'M 5.3 (5–95 %: M 4.9–5.6)'],
    ['{{ site.port-a.thermalMJM2.p50 }}', '0.034 MJ/m²'],
    ['{{ site.port-a.overpressureKPa.p95 | psi }}', '1 psi'],
    ['{{ site.port-a.windMS.p50 | km/h }}', '26 km/h'],
    ['{{ site.port-a.distanceKm.p50 }}', '44 km'],
    // The fixture is shaped like an assessment of an earlier model version: no band, no air energy.
    ['{{ site.port-a.tsunamiBand.high.runUpM.p50 }}', 'n/a (model version without the tsunami band)'],
    ['{{ airEnergyMt }}', 'n/a (model version without this figure)'],
  ])('renders %s as "%s"', (template, expected) => {
    expect(renderHazardFields(template, a)).toBe(expected)
  })

  it('replaces every field in a markdown body and leaves the rest untouched', () => {
    const body = '**Impact probability {{ impactProbability }}**, energy {{ energyMt.p50 }}.\n\n| site | run-up |\n| Port A | {{ site.port-a.runUpM.p95 }} |\n'
    expect(renderHazardFields(body, a)).toBe('**Impact probability 2.1 %**, energy 2.1 Mt.\n\n| site | run-up |\n| Port A | 4.6 m |\n')
  })

  it('keeps escaped braces literal and marks what it cannot render', () => {
    expect(renderHazardFields('\\{{ energyMt }} is {{ energyMt.p50 }}', a)).toBe('{{ energyMt }} is 2.1 Mt')
    expect(renderHazardFields('{{ site.gone.runUpM }}', a)).toBe('[no figures for site "gone"]')
    expect(renderHazardFields('{{ nope }}', a)).toBe('[unknown hazard field "nope"]')
  })

  it('quotes each law of the tsunami band and the energy deposited in the air when the engine gives them', () => {
    const b = assessmentFixture()
    const pc = (p5: number, p50: number, p95: number) => ({ p5, p50, p95 })
    b.sites[0]!.tsunamiBand = {
      low: { amplitudeM: pc(0.2, 0.4, 0.9), runUpM: pc(0.5, 1.1, 2.3) },
      high: { amplitudeM: pc(1, 2, 4.5), runUpM: pc(2.4, 5.2, 11) },
    }
    b.airEnergyMt = pc(0.5, 1.6, 3.9)
    expect(renderHazardFields('{{ site.port-a.tsunamiBand.low.runUpM.p50 }} to {{ site.port-a.tsunamiBand.high.runUpM.p50 }}', b))
      .toBe('1.1 m to 5.2 m')
    expect(renderHazardFields('{{ site.port-a.tsunamiBand.high.amplitudeM }}', b)).toBe('2 m (5–95 %: 1–4.5 m)')
    expect(renderHazardFields('{{ site.port-a.tsunamiBand.low.runUpM.range }}', b)).toBe('0.5–2.3 m')
    expect(renderHazardFields('{{ airEnergyMt.p50 | kt }}', b)).toBe('1,600 kt')
  })

  it('renders every catalogue field for a site without leaving braces behind', () => {
    for (const field of HAZARD_FIELDS) {
      const out = renderHazardFields(`{{ ${field.path.replace('<site>', 'port-a')} }}`, a)
      expect(out, field.path).not.toMatch(/[{}]|\[|undefined|NaN/)
    }
  })
})

describe('findHazardFields', () => {
  it('lists fields with their offsets, line and column, path and unit', () => {
    const body = 'Energy {{ energyMt.p50 | kt }}.\nRun-up {{site.port-a.runUpM}} and \\{{ literal }}.'
    expect(findHazardFields(body)).toEqual([
      { raw: '{{ energyMt.p50 | kt }}', path: 'energyMt.p50', unit: 'kt', start: 7, end: 30, line: 1, column: 8 },
      { raw: '{{site.port-a.runUpM}}', path: 'site.port-a.runUpM', start: 39, end: 61, line: 2, column: 8 },
    ])
  })
})

describe('validateHazardFields', () => {
  const sites = ['port-a']
  it.each([
    ['{{ energyMT.p50 }}', 'unknown hazard field "energyMT.p50" (did you mean "energyMt.p50"?)'],
    ['{{ energy }}', 'unknown hazard field "energy"'],
    ['{{ site.port-b.runUpM.p95 }}', 'unknown site "port-b" in hazard field "site.port-b.runUpM.p95"'],
    ['{{ site.port-a.runUp.p95 }}', 'unknown hazard field "site.port-a.runUp.p95"'],
    ['{{ site.port-a.RUNUPM.p95 }}', 'unknown hazard field "site.port-a.RUNUPM.p95" (did you mean "site.port-a.runUpM.p95"?)'],
    ['{{ energyMt.p50 | m }}', 'unit "m" does not apply to "energyMt.p50" (use Mt or kt)'],
    ['{{ torino | % }}', 'unit "%" does not apply to "torino" (it takes no unit)'],
    ['{{ energyMt | }}', 'malformed hazard field "{{ energyMt | }}" (expected "{{ path }}" or "{{ path | unit }}")'],
    ['{{ energy Mt }}', 'malformed hazard field "{{ energy Mt }}" (expected "{{ path }}" or "{{ path | unit }}")'],
    ['{{ }}', 'malformed hazard field "{{ }}" (expected "{{ path }}" or "{{ path | unit }}")'],
    ['{{ energyMt.p50 ', 'unclosed hazard field "{{" (close it with "}}" on the same line, or write "\\{{" for literal braces)'],
  ])('reports %s', (text, message) => {
    expect(validateHazardFields(text, sites).map(i => i.message)).toEqual([message])
  })

  it('accepts valid fields, units and escaped braces', () => {
    expect(validateHazardFields(
      '{{ energyMt }} {{ site.port-a.runUpM.p95 | km }} {{ impactProbability | odds }} \\{{ x }}',
      sites,
    )).toEqual([])
  })

  it('positions each issue in the text', () => {
    const [issue] = validateHazardFields('line one\n  and {{ bad.field }}', sites)
    expect(issue).toMatchObject({ start: 15, end: 30, line: 2, column: 7 })
  })
})

describe('HAZARD_FIELDS', () => {
  it('covers the assessment: every distribution with its percentiles and every threshold', () => {
    const paths = new Set(HAZARD_FIELDS.map(f => f.path))
    for (const key of ['diameterM', 'massKg', 'energyMt', 'burstAltitudeKm', 'surfaceEnergyMt', 'waterCavityDiameterM']) {
      for (const suffix of ['', '.p5', '.p50', '.p95', '.range']) expect(paths, key + suffix).toContain(key + suffix)
    }
    for (const key of ['runUpM', 'tsunamiArrivalMin', 'tsunamiMainArrivalMin', 'overpressureKPa', 'seismicMagnitude']) {
      expect(paths).toContain(`site.<site>.${key}.p95`)
    }
    for (const t of THRESHOLDS) {
      expect(paths).toContain(`exposedPopulation.${t.key}`)
      expect(paths).toContain(`site.<site>.exceedance.${t.key}`)
    }
    for (const key of ['impactProbability', 'airburstProbability', 'oceanImpactProbability', 'tsunamiProbability', 'torino', 'palermo']) {
      expect(paths).toContain(key)
    }
  })

  it('is documented: every segment of every field path appears in shared/scenario/README.md', () => {
    const readme = readFileSync(new URL('../../../shared/scenario/README.md', import.meta.url), 'utf8')
    const segments = new Set(HAZARD_FIELDS.flatMap(f => f.path.split('.')))
    for (const seg of ['site', '<site>', 'p5', 'p50', 'p95', 'range']) segments.delete(seg)
    for (const seg of segments) expect(readme, seg).toContain(`\`${seg}`)
  })

  it('gives every field a label and lists its default unit among the accepted ones', () => {
    for (const f of HAZARD_FIELDS) {
      expect(f.label.length, f.path).toBeGreaterThan(3)
      if (f.unit) expect(f.units, f.path).toContain(f.unit)
    }
  })
})

describe('number formatting', () => {
  it.each([
    [2.134, '2.1'], [0.8, '0.8'], [1234, '1,200'], [187, '190'], [0.0456, '0.046'], [0, '0'], [-3.21, '-3.2'],
    [8.2e9, '8.2 × 10⁹'], [3.1e-5, '3.1 × 10⁻⁵'], [999_999, '1,000,000'],
  ])('shows %d as "%s"', (x, text) => {
    expect(formatSignificant(x)).toBe(text)
  })

  it.each([
    [0, '0 %'], [1, '100 %'], [0.00000042, '< 0.01 %'], [0.00021, '0.021 %'], [0.0213, '2.1 %'], [0.5, '50 %'],
    [0.97, '97 %'], [0.997, '99.7 %'], [0.9999999, '> 99.99 %'],
  ])('shows the probability %d as "%s"', (p, text) => {
    expect(formatPercent(p)).toBe(text)
  })

  it('shows odds', () => {
    expect([0, 0.00021, 0.0213, 0.5, 1].map(formatOdds)).toEqual(['none', '1 in 4,800', '1 in 47', '1 in 2', 'certain'])
  })

  it('renders sites of a multi-site assessment by id', () => {
    const two = assessmentFixture([
      siteFixture('port-a', 'Port A', 1),
      siteFixture('port-b', 'Port B', 2, { runUpM: { p5: 5, p50: 7, p95: 9 } }),
    ])
    expect(renderHazardFields('{{ site.port-a.runUpM.p50 }} / {{ site.port-b.runUpM.p50 }}', two)).toBe('2.6 m / 7 m')
  })
})
