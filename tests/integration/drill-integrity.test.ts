// What players answered stays what they saw: an inject whose figures have no published solution is not released
// without the facilitator's say-so (before, its teams read "n/a (no orbit solution published yet)" and control was
// not told), and when it is, they read "figures not yet available" in the project's own marking.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, newLiveExercise, type LiveCast } from '../support/live'
import { findHazardFields } from '../../shared/scenario/fields'
import { NO_SOLUTION_YET } from '../../shared/live/pending'
import type { Scenario } from '../../shared/scenario/schema'

let cast: LiveCast
let scenario: Scenario
const url = (p = '') => `/api/exercises/${cast.id}${p}`

beforeAll(async () => {
  cast = await newLiveExercise('Integrity drill')
  const list = (await cast.facilitator.client.get('/api/scenarios')).json as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  scenario = (await cast.facilitator.client.get(`/api/scenarios/${demo.id}`)).json.document as Scenario
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
