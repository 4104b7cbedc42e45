// A membership change reaches the member's open sockets at once: removed or moved, a socket hears nothing more of
// what its old role or team was sent (before, a removed member's socket went on receiving another team's traffic).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, ikey, liveSocket, newLiveExercise, ready, until, type LiveCast, type LiveSocket } from '../support/live'

let cast: LiveCast

beforeAll(async () => { cast = await newLiveExercise('Membership sockets drill') }, 60_000)
afterAll(() => closeSockets())

/** Follows the exercise as one person, and records why the server dropped the socket. */
async function follow(person: LiveCast['science']) {
  const s = liveSocket(person.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
  const drops: Array<{ reason: string; change?: string }> = []
  s.socket.on('live:membership', (m: { change: string }) => drops.push({ reason: 'notice', change: m.change }))
  s.socket.on('disconnect', (reason: string) => drops.push({ reason }))
  await ready(s)
  return { s, drops }
}

/** The facilitator sends a message to one team. */
async function message(team: string, title: string): Promise<void> {
  const r = await cast.facilitator.client.post(`/api/exercises/${cast.id}/messages`, {
    teams: [team], title, body: 'For that team only.', idempotencyKey: ikey(),
  })
  expect(r.status).toBeLessThan(300)
}

const titles = (s: LiveSocket) => s.events.map(e => e.data?.title).filter(Boolean)

describe('membership changes reach open sockets', () => {
  it('disconnects a removed member at once; nothing more reaches that socket', async () => {
    const { s, drops } = await follow(cast.comms)
    await message('comms', 'Before removal')
    await until(() => titles(s).includes('Before removal'), 10_000, 'message before removal')
    const del = await cast.facilitator.client.delete(`/api/exercises/${cast.id}/members/${cast.comms.id}`)
    expect(del.status).toBe(204)
    await until(() => drops.some(d => d.reason === 'io server disconnect'), 5000, 'disconnect after removal')
    expect(drops[0]).toEqual({ reason: 'notice', change: 'removed' })
    await message('comms', 'After removal')
    await new Promise(r => setTimeout(r, 500))
    expect(titles(s)).not.toContain('After removal')
    // And the removed member cannot follow again.
    const again = liveSocket(cast.comms.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    await until(() => again.errors[0], 5000, 'refusal')
    expect(again.errors[0]!.message).toBe('forbidden')
  }, 30_000)

  it('drops a member moved to another team; reconnected, the socket follows the new team only', async () => {
    const { s, drops } = await follow(cast.civil)
    const patch = await cast.facilitator.client.patch(`/api/exercises/${cast.id}/members/${cast.civil.id}`, {
      role: 'player', teamKey: 'science',
    })
    expect(patch.status).toBe(200)
    await until(() => drops.some(d => d.reason === 'io server disconnect'), 5000, 'disconnect after the move')
    expect(drops[0]).toEqual({ reason: 'notice', change: 'changed' })
    await message('civil', 'For the old team')
    await new Promise(r => setTimeout(r, 300))
    expect(titles(s)).not.toContain('For the old team')
    const next = liveSocket(cast.civil.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    const r = await ready(next)
    expect(r.teamKey).toBe('science')
    expect(titles(next)).not.toContain('For the old team')
  }, 30_000)

  it('drops an evaluator demoted to player, who then no longer hears evaluator traffic', async () => {
    const { drops } = await follow(cast.evaluator)
    const patch = await cast.facilitator.client.patch(`/api/exercises/${cast.id}/members/${cast.evaluator.id}`, {
      role: 'player', teamKey: 'comms',
    })
    expect(patch.status).toBe(200)
    await until(() => drops.some(d => d.reason === 'io server disconnect'), 5000, 'disconnect after the demotion')
    const next = liveSocket(cast.evaluator.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    const r = await ready(next)
    expect(r.view).toBe('player')
  }, 30_000)

  it('leaves a member whose membership did not change connected', async () => {
    const { s, drops } = await follow(cast.science)
    const patch = await cast.facilitator.client.patch(`/api/exercises/${cast.id}/members/${cast.science.id}`, {
      role: 'player', teamKey: 'science',
    })
    expect(patch.status).toBe(200)
    await new Promise(r => setTimeout(r, 300))
    expect(drops).toEqual([])
    expect(s.socket.connected).toBe(true)
  }, 30_000)
})
