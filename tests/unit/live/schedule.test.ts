import { describe, expect, it } from 'vitest'
import { dueItems, injectState, nextInjectAt, phaseAt } from '../../../shared/live/schedule'

const scenario = {
  phases: [{ key: 'detection', title: 'Detection' }, { key: 'follow-up', title: 'Follow-up' }],
  solutions: [{ key: 's1', releaseAt: '2031-03-04T06:00:00Z' }, { key: 's2', releaseAt: '2031-03-16T08:00:00Z' }],
  injects: [
    { key: 'a', at: '2031-03-04T02:10:00Z', phase: 'detection' },
    { key: 'b', at: '2031-03-04T06:00:00Z', phase: 'detection' },
    { key: 'c', at: '2031-03-10T00:00:00Z', phase: 'detection', contingency: { condition: 'if asked' } },
    { key: 'd', at: '2031-03-16T09:00:00Z', phase: 'follow-up' },
  ],
} as unknown as Parameters<typeof dueItems>[0] & Parameters<typeof phaseAt>[0]
const t = (iso: string) => Date.parse(iso)

describe('what falls due', () => {
  it('lists unpublished solutions and unreleased, unheld, non-contingency injects in time order, a solution first on a tie', () => {
    const due = dueItems(scenario, new Set(), new Map(), t('2031-03-20T00:00:00Z'))
    expect(due.map(d => d.key)).toEqual(['a', 's1', 'b', 's2', 'd'])
  })

  it('skips what is already published, released or held', () => {
    const due = dueItems(scenario, new Set(['s1']), new Map([['a', 'released'], ['b', 'held']]), t('2031-03-20T00:00:00Z'))
    expect(due.map(d => d.key)).toEqual(['s2', 'd'])
  })

  it('lists nothing before the first time', () => {
    expect(dueItems(scenario, new Set(), new Map(), t('2031-03-04T00:00:00Z'))).toEqual([])
  })

  it('finds the next inject to jump to, skipping contingencies and what is held or released', () => {
    expect(nextInjectAt(scenario, new Map(), t('2031-03-04T06:00:00Z'))).toBe(t('2031-03-16T09:00:00Z'))
    expect(nextInjectAt(scenario, new Map([['b', 'held']]), t('2031-03-04T03:00:00Z'))).toBe(t('2031-03-16T09:00:00Z'))
    expect(nextInjectAt(scenario, new Map(), t('2031-04-01T00:00:00Z'))).toBeNull()
  })

  it('names the phase of the latest inject due, or the first phase', () => {
    expect(phaseAt(scenario, t('2031-03-01T00:00:00Z'))).toBe('detection')
    expect(phaseAt(scenario, t('2031-03-17T00:00:00Z'))).toBe('follow-up')
  })
})

describe('desk states', () => {
  const inj = { at: t('2031-03-04T09:00:00Z'), deadline: t('2031-03-04T18:00:00Z'), teams: ['science', 'civil'] }
  const cases: Array<[string, 'held' | 'released' | null, string[], string, string]> = [
    ['before its time', null, [], '2031-03-04T08:00:00Z', 'upcoming'],
    ['past its time, not released', null, [], '2031-03-04T10:00:00Z', 'due'],
    ['held', 'held', [], '2031-03-04T10:00:00Z', 'held'],
    ['released, waiting for answers', 'released', ['science'], '2031-03-04T10:00:00Z', 'released'],
    ['released, every team answered', 'released', ['science', 'civil'], '2031-03-05T10:00:00Z', 'answered'],
    ['released, deadline passed without every answer', 'released', ['science'], '2031-03-05T10:00:00Z', 'overdue'],
  ]
  for (const [what, status, answered, at, expected] of cases) {
    it(`${what} → ${expected}`, () => {
      expect(injectState(inj, status, new Set(answered), t(at))).toBe(expected)
    })
  }

  it('an inject without a decision is just released', () => {
    expect(injectState({ ...inj, deadline: null }, 'released', new Set(), t('2031-04-01T00:00:00Z'))).toBe('released')
  })
})
