// What players answered stays what they saw: an inject whose figures have no published solution is not released
// without the facilitator's say-so (before, its teams read "n/a (no orbit solution published yet)" and control was
// not told), and when it is, they read "figures not yet available" in the project's own marking.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, demoScenario, ikey, newLiveExercise, type LiveCast } from '../support/live'
import { findHazardFields } from '../../shared/scenario/fields'
import { NO_SOLUTION_YET } from '../../shared/live/pending'
import { PUBLISH_SAMPLES, solutionSeed } from '../../shared/live/seed'
import type { Scenario } from '../../shared/scenario/schema'

let cast: LiveCast
let scenario: Scenario
const url = (p = '') => `/api/exercises/${cast.id}${p}`

beforeAll(async () => {
  cast = await newLiveExercise('Integrity drill')
  scenario = await demoScenario(cast.facilitator)
}, 60_000)
afterAll(() => closeSockets())

describe('figures before their solution', () => {
  it('refuses the release (409 no-solution, naming the solution), then releases when confirmed, with the marked placeholder', async () => {
    const inject = scenario.injects.find(i => findHazardFields(i.body).length > 0 && !i.solution)!
    const refused = await cast.facilitator.client.post(url(`/injects/${inject.key}/release`), {})
    expect(refused.status).toBe(409)
    expect(refused.json.data).toMatchObject({ code: 'no-solution', solutionKey: scenario.solutions[0]!.key })
    expect(refused.json.message).toContain(scenario.solutions[0]!.label)
    // Nothing went out.
    const events = (await cast.facilitator.client.get(url('/events'))).json.events as Array<{ type: string }>
    expect(events.filter(e => e.type === 'inject.released')).toHaveLength(0)

    const forced = await cast.facilitator.client.post(url(`/injects/${inject.key}/release`), { force: true })
    expect(forced.status).toBe(201)
    const team = inject.teams[0]!
    const player = cast[team as 'science' | 'civil' | 'comms']
    const room = (await player.client.get(url('/live'))).json
    const body = room.injects.find((i: { key: string }) => i.key === inject.key).body as string
    expect(body).toContain(NO_SOLUTION_YET)
    expect(body).not.toContain('n/a')
  })

  it('refuses an inject that presents a solution not yet published, though an earlier one is', async () => {
    const first = scenario.solutions[0]!.key
    const pinned = scenario.injects.find(i => i.solution && i.solution !== first && findHazardFields(i.body).length > 0)
    if (!pinned) return expect(scenario.solutions.length).toBeLessThan(2)
    expect((await cast.facilitator.client.post(url(`/solutions/${scenario.solutions[0]!.key}/publish`), {})).status).toBe(201)
    const refused = await cast.facilitator.client.post(url(`/injects/${pinned.key}/release`), {})
    expect(refused.status).toBe(409)
    expect(refused.json.data).toMatchObject({ code: 'no-solution', solutionKey: pinned.solution })
    // Published, it goes out with its figures.
    expect((await cast.facilitator.client.post(url(`/solutions/${pinned.solution}/publish`), {})).status).toBe(201)
    const released = await cast.facilitator.client.post(url(`/injects/${pinned.key}/release`), {})
    expect(released.status).toBe(201)
    expect(released.json.event.data.body).not.toContain(NO_SOLUTION_YET)
    expect(released.json.event.data.solutionKey).toBe(pinned.solution)
  })
})

describe('answers keep their context', () => {
  it('records the revision a team answered; a later solution revises the inject, the answer still names the old one', async () => {
    const c = await newLiveExercise('Revision drill')
    const u = (p = '') => `/api/exercises/${c.id}${p}`
    const [s1, s2] = scenario.solutions
    const inject = scenario.injects.find(i => i.decision && !i.solution && !i.contingency && findHazardFields(i.body).length > 0
      && i.teams.some(t => ['science', 'civil', 'comms'].includes(t)))!
    const team = inject.teams.find(t => ['science', 'civil', 'comms'].includes(t)) as 'science' | 'civil' | 'comms'
    expect((await c.facilitator.client.post(u(`/solutions/${s1!.key}/publish`), {})).status).toBe(201)
    expect((await c.facilitator.client.post(u(`/injects/${inject.key}/release`), {})).status).toBe(201)
    const tooNew = await c[team].client.post(u('/responses'), { injectKey: inject.key, text: 'Evacuate.', injectRevision: 3, idempotencyKey: ikey() })
    expect(tooNew.status).toBe(400)
    const answer = await c[team].client.post(u('/responses'), { injectKey: inject.key, text: 'Evacuate.', injectRevision: 0, idempotencyKey: ikey() })
    expect(answer.status).toBe(201)
    expect(answer.json.event.data.injectRevision).toBe(0)
    expect((await c.facilitator.client.post(u(`/solutions/${s2!.key}/publish`), {})).status).toBe(201)
    const room = (await c[team].client.get(u('/live'))).json
    const card = room.injects.find((i: { key: string }) => i.key === inject.key)
    expect(card.revision).toBe(1)
    expect(card.revisions.map((r: { revision: number }) => r.revision)).toEqual([0, 1])
    expect(card.responses[0].injectRevision).toBe(0)
    const review = (await c.facilitator.client.get(u('/review/decisions'))).json
    const row = review.rows.find((r: { injectKey: string; teamKey: string }) => r.injectKey === inject.key && r.teamKey === team)
    expect(row.first.injectRevision).toBe(0)
    expect(row.revision).toBe(1)
  })
})

describe('jumps keep the script', () => {
  const decisionInject = () => scenario.injects
    .filter(i => i.decision && !i.contingency)
    .sort((a, b) => Date.parse(a.at) - Date.parse(b.at))[0]!

  it('releases what fell due with its deadline moved by as much as it came late', async () => {
    const c = await newLiveExercise('Jump release drill')
    const u = (p = '') => `/api/exercises/${c.id}${p}`
    const inject = decisionInject()
    expect((await c.facilitator.client.post(u('/clock'), { action: 'start', factor: 1 })).status).toBe(200)
    const to = new Date(Date.parse(inject.at) + 6 * 3_600_000).toISOString()
    expect((await c.facilitator.client.post(u('/clock'), { action: 'jump', to })).status).toBe(200)
    const events = (await c.facilitator.client.get(u('/events'))).json.events as Array<{ type: string; scenarioTime: string; data: any }> // eslint-disable-line @typescript-eslint/no-explicit-any
    const released = events.find(e => e.type === 'inject.released' && e.data.key === inject.key)!
    const lateMs = Date.parse(released.scenarioTime) - Date.parse(inject.at)
    expect(lateMs).toBeGreaterThanOrEqual(6 * 3_600_000 - 1000)
    // The time the script allowed is kept: before, the team saw "Deadline passed".
    expect(Date.parse(released.data.decision.deadline) - Date.parse(released.scenarioTime))
      .toBeCloseTo(Date.parse(inject.decision!.deadline) - Date.parse(inject.at), -4)
    const review = (await c.facilitator.client.get(u('/review/decisions'))).json
    const row = review.rows.find((r: { injectKey: string }) => r.injectKey === inject.key)
    expect(row.allowedMin).toBeGreaterThan(0)
    expect(row.status).toBe('pending')
  })

  it('skips what fell due when asked: held, not released, and control may release it later', async () => {
    const c = await newLiveExercise('Jump skip drill')
    const u = (p = '') => `/api/exercises/${c.id}${p}`
    const inject = decisionInject()
    expect((await c.facilitator.client.post(u('/clock'), { action: 'start', factor: 1 })).status).toBe(200)
    const to = new Date(Date.parse(inject.at) + 3_600_000).toISOString()
    expect((await c.facilitator.client.post(u('/clock'), { action: 'jump', to, due: 'skip' })).status).toBe(200)
    await new Promise(r => setTimeout(r, 600))
    const events = (await c.facilitator.client.get(u('/events'))).json.events as Array<{ type: string; data: { key?: string; skippedByJump?: boolean } }>
    expect(events.some(e => e.type === 'inject.released' && e.data.key === inject.key)).toBe(false)
    expect(events.find(e => e.type === 'inject.held' && e.data.key === inject.key)?.data.skippedByJump).toBe(true)
    // Solutions that fell due are still published.
    expect(events.some(e => e.type === 'solution.published')).toBe(true)
    expect((await c.facilitator.client.post(u(`/injects/${inject.key}/release`), { force: true })).status).toBe(201)
  })
})

describe('one set of numbers', () => {
  it('gives the library brief (a preview with the solution\'s seed) the figures a drill publishes', async () => {
    const c = await newLiveExercise('Same numbers drill')
    const s = scenario.solutions[1]!
    expect((await c.facilitator.client.post(`/api/exercises/${c.id}/solutions/${s.key}/publish`, {})).status).toBe(201)
    const drill = (await c.facilitator.client.get(`/api/exercises/${c.id}/review/solutions/${s.key}`)).json.assessment
    const brief = (await c.facilitator.client.post('/api/scenarios/preview', {
      solution: s.solution, sites: scenario.sites, samples: PUBLISH_SAMPLES, seed: solutionSeed(scenario.key, s.key),
    })).json
    expect(brief.energyMt).toEqual(drill.energyMt)
    expect(brief.impactProbability).toBe(drill.impactProbability)
    expect(brief.sites).toEqual(drill.sites)
  })
})

describe('local time', () => {
  it('gives every desk the scenario\'s time zone and the nominal impact time of the latest solution; exports carry local time', async () => {
    const c = await newLiveExercise('Local time drill')
    const u = (p = '') => `/api/exercises/${c.id}${p}`
    expect(scenario.clock.timeZone).toBe('Europe/Lisbon')
    const before = (await c.science.client.get(u('/live'))).json
    expect(before.timeZone).toBe('Europe/Lisbon')
    expect(before.impactTime).toBeNull()
    const s = scenario.solutions[0]!
    expect((await c.facilitator.client.post(u(`/solutions/${s.key}/publish`), {})).status).toBe(201)
    expect((await c.science.client.get(u('/live'))).json.impactTime).toBe(s.solution.impactTime)
    const csv = (await c.facilitator.client.get(u('/timeline.csv'))).text
    const lines = csv.split(/\r?\n/)
    const at = lines.findIndex(l => l.startsWith('Seq,'))
    const [head, first] = [lines[at]!, lines[at + 1]!]
    expect(head).toContain('Scenario time (local)')
    // Lisbon is UTC+0 in winter and UTC+1 in summer (civil calendar, common practice, no source).
    expect(first).toMatch(/\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC\+[01]/)
  })
})
