import { describe, expect, it } from 'vitest'
import { feedbackSummary } from '../../../shared/review/feedback'
import { eventFacets } from '../../../shared/review/facets'
import { pdfSafe } from '../../../shared/review/pdftext'
import { feedbackSchema, improvementPatchSchema, improvementSchema } from '../../../shared/schemas/review'
import { ev, inject, resetSeq, response, scenario } from './fixtures'

describe('the feedback summary', () => {
  it('counts answers per statement and keeps comments by role and team', () => {
    const at = '2031-10-01T00:00:00Z'
    const s = feedbackSummary([
      { role: 'player', teamKey: 'science', wentWell: 'Odds', toImprove: '', ratings: { objectives: 5, pace: 2 }, submittedAt: at },
      { role: 'evaluator', teamKey: null, wentWell: '', toImprove: '', ratings: { objectives: 4 }, submittedAt: at },
    ], 6)
    expect(s).toMatchObject({ responses: 2, invited: 6 })
    expect(s.questions.find(q => q.key === 'objectives')).toMatchObject({ n: 2, mean: 4.5, counts: [0, 0, 0, 1, 1] })
    expect(s.questions.find(q => q.key === 'realism')).toMatchObject({ n: 0, mean: null })
    expect(s.comments).toEqual([{ role: 'player', teamKey: 'science', wentWell: 'Odds', toImprove: '', submittedAt: at }])
  })
})

describe('timeline facets', () => {
  it('names the teams an event concerns and its phase', () => {
    resetSeq()
    expect(eventFacets(
      ev('inject.released', 0, inject('ask', ['science'], 'detection')),
      scenario,
    )).toMatchObject({ teamKeys: ['science'], phaseKey: 'detection' })
    expect(eventFacets(
      ev('response.submitted', 60 * 24 * 2, response('warn-now', 'civil')),
      scenario,
    )).toMatchObject({ teamKeys: ['civil'], phaseKey: 'warning' })
    expect(eventFacets(ev('clock.changed', 0, { action: 'start' }), scenario)).toMatchObject({ teamKeys: [], phaseKey: 'detection' })
  })
})

describe('text for the PDF fonts', () => {
  it.each([
    ['8.2 × 10⁹ Mt', '8.2 × 10^9 Mt'],
    ['1.5 × 10⁻³', '1.5 × 10^-3'],
    ['κ ≥ 0.6 → substantial', 'kappa >= 0.6 -> substantial'],
    ['Baía do Lince — 5–95 %', 'Baía do Lince — 5–95 %'],
  ])('writes %s as %s', (input, output) => {
    expect(pdfSafe(input)).toBe(output)
  })
})

describe('improvement plan bodies', () => {
  const item = {
    objectiveKey: 'warn',
    capability: 'Public Information and Warning',
    action: 'Template',
    element: 'planning',
    owner: 'JIC',
    startDate: '2031-10-01',
    dueDate: '2031-12-15',
  }

  it('default to open and refuse a due date before the start', () => {
    expect(improvementSchema.parse(item).status).toBe('open')
    const r = improvementSchema.safeParse({ ...item, dueDate: '2031-09-01' })
    expect(r.success ? [] : r.error.issues.map(i => i.path.join('.'))).toEqual(['dueDate'])
  })

  it.each(['2031-02-29', '2031-13-01', '1 Oct 2031', ''])('refuse %j as a date', (startDate) => {
    const r = improvementSchema.safeParse({ ...item, startDate })
    expect(r.success ? [] : r.error.issues.map(i => i.path.join('.'))).toEqual(['startDate'])
  })

  it('patch only the fields sent (no defaults filled in)', () => {
    expect(improvementPatchSchema.parse({ owner: 'Press office' })).toEqual({ owner: 'Press office' })
    expect(improvementPatchSchema.safeParse({}).success).toBe(false)
  })

  it('rate each feedback statement 1 to 5', () => {
    const ratings = { objectives: 1, realism: 5, figures: 3, coordination: 3, pace: 3 }
    expect(feedbackSchema.parse({ ratings })).toEqual({ ratings, wentWell: '', toImprove: '' })
    expect(feedbackSchema.safeParse({ ratings: { ...ratings, pace: 0 } }).success).toBe(false)
  })
})
