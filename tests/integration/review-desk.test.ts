import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client } from '../support/client'
import { closeSockets } from '../support/live'
import { KAPPA_BY_HAND, playReviewDrill, RATED, type ReviewDrill } from '../support/review-drill'

let d: ReviewDrill
const url = (p = '') => `/api/exercises/${d.id}${p}`

beforeAll(async () => { d = await playReviewDrill('Review desk drill') }, 180_000)
afterAll(() => closeSockets())

describe('the review desk', () => {
  it('opens for the analyst, the facilitator and the evaluators, not for players or strangers', async () => {
    for (const who of [d.analyst, d.facilitator, d.evaluator, d.evaluator2]) {
      for (const part of [
        '/review',
        '/review/decisions',
        '/review/scoring',
        '/review/replay',
      ]) expect((await who.client.get(url(part))).status, part).toBe(200)
    }
    for (const who of [d.science, d.civil, d.comms]) {
      const res = await who.client.get(url('/review'))
      expect(res.status).toBe(403)
      expect(res.json.message).toMatch(/role/i)
    }
    expect((await new Client().get(url('/review'))).status).toBe(401)
    const { client: stranger } = await (await import('../support/live')).newPerson('Stranger')
    expect((await stranger.get(url('/review'))).status).toBe(404)
  })

  it('shows the whole record as a timeline with teams and phases to filter by, and who may write', async () => {
    const res = await d.analyst.client.get(url('/review'))
    const events = (await d.facilitator.client.get(url('/events?since=0&limit=1000'))).json.events
    expect(res.json.timeline.map((r: { seq: number }) => r.seq)).toEqual(events.map((e: { seq: number }) => e.seq))
    const response = res.json.timeline.find((r: {
      type: string
      injectKey: string
    }) => r.type === 'response.submitted' && r.injectKey === 'blogger-risk-table')
    expect(response).toMatchObject({ teamKeys: ['comms'], phaseKey: 'detection' })
    expect(response.wallTime).toMatch(/Z$/)
    expect(response.scenarioTime).toMatch(/^2031-03-07/)
    expect(res.json.exercise.status).toBe('ended')
    expect(res.json.exercise.startedAt).toBeTruthy()
    expect(res.json.exercise.endedAt).toBeTruthy()
    // The analyst may also follow the drill on the evaluator desk; only the facilitator runs it.
    expect(res.json.can).toEqual({ write: true, export: true, evaluate: true, control: false })
    expect((await d.evaluator.client.get(url('/review'))).json.can).toEqual({ write: false, export: false, evaluate: true, control: false })
    expect((await d.facilitator.client.get(url('/review'))).json.can).toMatchObject({ evaluate: true, control: true })
  })

  it('times each decision from release to the first response, against the deadline', async () => {
    const { json } = await d.analyst.client.get(url('/review/decisions'))
    const notify = json.rows.find((r: { injectKey: string }) => r.injectKey === 'notify-civil-protection')
    expect(notify).toMatchObject({ teamKey: 'science', status: 'on-time', deadline: '2031-03-04T18:00:00.000Z', responses: 1 })
    expect(notify.first.choice).toBe('Formal notification under the hazard plan')
    expect(notify.responseMin).toBeGreaterThanOrEqual(0)
    expect(notify.responseWallMin).toBeGreaterThanOrEqual(0)
    const blogger = json.rows.find((r: { injectKey: string }) => r.injectKey === 'blogger-risk-table')
    expect(blogger).toMatchObject({ teamKey: 'comms', status: 'late' })
    // Released near the scenario start (3 March), answered right after the jump to 7 March 00:00: late (the jump
    // passed its deadline), but the team spent almost no scenario time on it, as the jump is not theirs.
    expect(blogger.responseMin).toBeGreaterThanOrEqual(0)
    expect(blogger.responseMin).toBeLessThan(60)
    expect(blogger.shareOfAllowed).toBeLessThan(1)
    const science = json.byTeam.find((g: { key: string }) => g.key === 'science')
    expect(science).toMatchObject({ decisions: 1, answered: 1, onTime: 1, late: 0 })
    expect(json.byTeam.find((g: { key: string }) => g.key === 'comms')).toMatchObject({ decisions: 1, answered: 1, onTime: 0, late: 1 })
    expect(json.byPhase.find((g: { key: string }) => g.key === 'detection').decisions).toBe(json.rows.filter((r: { phase: string }) => r.phase === 'detection').length)
  })

  it('summarises the ratings by objective and capability, with kappa as worked out by hand', async () => {
    const { json } = await d.analyst.client.get(url('/review/scoring'))
    expect(json.evaluators).toHaveLength(2)
    expect(json.agreement).toHaveLength(1)
    const pair = json.agreement[0]
    expect(pair.n).toBe(6)
    expect(pair.observed).toBeCloseTo(4 / 6, 10)
    expect(pair.expected).toBeCloseTo(1 / 4, 10)
    expect(pair.kappa).toBeCloseTo(KAPPA_BY_HAND, 10)
    expect(pair.strength).toBe('moderate')
    const disagreed = RATED.filter(r => r.a !== r.b).map(r => r.taskKey).sort()
    expect(json.disagreements.map((x: { taskKey: string }) => x.taskKey).sort()).toEqual(disagreed)

    const picture = json.objectives.find((o: { key: string }) => o.key === 'shared-picture')
    const situational = picture.capabilities.find((c: { name: string }) => c.name === 'Situational Assessment')
    const interpret = situational.criteria[0].tasks.find((t: { key: string }) => t.key === 'interpret-each-solution')
    // Evaluator 1's first U was replaced by P; both now say P.
    expect(interpret.ratings.map((r: { rating: string }) => r.rating)).toEqual(['P', 'P'])
    expect(interpret.ratings.find((r: { replaced: number }) => r.replaced === 1).note).toBe('A on interpret-each-solution')
    expect(picture.counts).toEqual({ P: 3, S: 4, M: 3, U: 2 })
    const coordination = picture.capabilities.find((c: { name: string }) => c.name === 'Operational Coordination')
    expect(coordination.observations.map((o: { text: string }) => o.text)).toEqual(['Science cell phoned the duty officer within the hour.'])
    expect(json.observations).toHaveLength(1)
  })

  it('replays the record with audiences, the assessments fetched one solution at a time', async () => {
    const { json } = await d.analyst.client.get(url('/review/replay'))
    const published = json.events.filter((e: { type: string }) => e.type === 'solution.published')
    expect(published.map((e: { data: { key: string } }) => e.data.key)).toEqual(['s1-discovery', 's7-certain'])
    expect(published[0].data.assessment).toBeUndefined()
    expect(json.events.find((e: { type: string }) => e.type === 'response.submitted').audience).toMatch(/^teams:/)
    const s7 = await d.evaluator.client.get(url('/review/solutions/s7-certain'))
    expect(s7.status).toBe(200)
    expect(s7.json.assessment.impactProbability).toBe(s7.json.headline.impactProbability)
    expect((await d.analyst.client.get(url('/review/solutions/s3-precovery'))).status).toBe(404)
    expect((await d.science.client.get(url('/review/solutions/s7-certain'))).status).toBe(403)
  })
})
