import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { FEEDBACK_MIN_GROUP, feedbackSummary, type FeedbackEntry } from '../../../shared/review/feedback'
import { eventFacets } from '../../../shared/review/facets'
import { pdfSafe } from '../../../shared/review/pdftext'
import { feedbackSchema, improvementPatchSchema, improvementSchema } from '../../../shared/schemas/review'
import { ev, inject, resetSeq, response, scenario } from './fixtures'

describe('the feedback summary', () => {
  const at = '2031-10-01T00:00:00Z'
  const entry = (role: FeedbackEntry['role'], teamKey: string | null, wentWell: string, submittedAt = at): FeedbackEntry =>
    ({ role, teamKey, wentWell, toImprove: '', ratings: {}, submittedAt })

  it('counts answers per statement, and holds back comments while fewer than three people wrote any', () => {
    const s = feedbackSummary([
      { role: 'player', teamKey: 'science', wentWell: 'Odds', toImprove: '', ratings: { objectives: 5, pace: 2 }, submittedAt: at },
      { role: 'evaluator', teamKey: null, wentWell: '', toImprove: '', ratings: { objectives: 4 }, submittedAt: at },
    ], 6)
    expect(s).toMatchObject({ responses: 2, invited: 6 })
    expect(s.questions.find(q => q.key === 'objectives')).toMatchObject({ n: 2, mean: 4.5, counts: [0, 0, 0, 1, 1] })
    expect(s.questions.find(q => q.key === 'realism')).toMatchObject({ n: 0, mean: null })
    expect(s.comments).toEqual([])
    expect(s.commentsWithheld).toBe(1)
  })

  it('groups by team where three of a team wrote, else by role, else all together; texts sorted, no times', () => {
    const s = feedbackSummary([
      entry('player', 'science', 'c', '2031-10-01T03:00:00Z'), entry('player', 'science', 'a'), entry('player', 'science', 'b'),
      entry('player', 'civil', 'd'), entry('player', 'comms', 'e'), entry('player', 'comms', 'f'),
    ], 6)
    expect(s.comments).toEqual([
      { role: 'player', teamKey: 'science', people: 3, wentWell: ['a', 'b', 'c'], toImprove: [] },
      { role: 'player', teamKey: null, people: 3, wentWell: ['d', 'e', 'f'], toImprove: [] },
    ])
    expect(JSON.stringify(s)).not.toContain('2031')
    // One evaluator among them cannot be told apart: everything goes into one group.
    const mixed = feedbackSummary([entry('player', 'science', 'a'), entry('player', 'science', 'b'), entry('player', 'science', 'c'),
      entry('evaluator', null, 'z')], 4)
    expect(mixed.comments).toEqual([{ role: null, teamKey: null, people: 4, wentWell: ['a', 'b', 'c', 'z'], toImprove: [] }])
  })

  it('never shows a group of fewer than three, and loses no comment once three people wrote', () => {
    const roles = ['player', 'evaluator', 'analyst', 'facilitator', null] as const
    const arb = fc.array(fc.record({
      role: fc.constantFrom(...roles), teamKey: fc.constantFrom('science', 'civil', 'comms', null), wentWell: fc.string({ minLength: 1, maxLength: 5 }),
    }), { maxLength: 20 })
    fc.assert(fc.property(arb, (xs) => {
      const entries = xs.map(x => entry(x.role, x.role === 'player' ? x.teamKey : null, x.wentWell))
      const writers = entries.filter(e => e.wentWell.trim()).length
      const s = feedbackSummary(entries, 0)
      for (const g of s.comments) expect(g.people).toBeGreaterThanOrEqual(FEEDBACK_MIN_GROUP)
      const shown = s.comments.reduce((n, g) => n + g.people, 0)
      expect(shown + s.commentsWithheld).toBe(writers)
      if (writers >= FEEDBACK_MIN_GROUP) expect(shown).toBe(writers)
    }), { numRuns: 500 })
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
