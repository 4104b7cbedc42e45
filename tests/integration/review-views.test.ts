// The review desk shows each reader their own view of the record: an evaluator does not read the facilitator's holds
// through /review or /review/replay (before, both served the control view to every reader).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, newLiveExercise, type LiveCast } from '../support/live'

let cast: LiveCast
let held: string

beforeAll(async () => {
  cast = await newLiveExercise('Review views drill')
  const ex = await cast.facilitator.client.get(`/api/exercises/${cast.id}`)
  held = (ex.json.scenario?.injects ?? ex.json.injects ?? [])[0]?.key ?? 'survey-candidate'
  const r = await cast.facilitator.client.post(`/api/exercises/${cast.id}/injects/${held}/hold`)
  expect(r.status).toBeLessThan(300)
}, 60_000)
afterAll(() => closeSockets())

const heldIn = (events: Array<{ type: string }>) => events.filter(e => e.type === 'inject.held').length

describe('the review desk reads with the reader\'s own view', () => {
  it('keeps the hold from an evaluator in /review and /review/replay, and shows it to the facilitator', async () => {
    const mine = await cast.evaluator.client.get(`/api/exercises/${cast.id}/review`)
    expect(mine.status).toBe(200)
    expect(JSON.stringify(mine.json.timeline)).not.toMatch(/held/i)
    const replay = await cast.evaluator.client.get(`/api/exercises/${cast.id}/review/replay`)
    expect(replay.status).toBe(200)
    expect(heldIn(replay.json.events)).toBe(0)

    const control = await cast.facilitator.client.get(`/api/exercises/${cast.id}/review/replay`)
    expect(heldIn(control.json.events)).toBe(1)
  })
})
