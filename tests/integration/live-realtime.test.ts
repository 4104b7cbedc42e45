// The live socket: who may follow an exercise, which rooms hear what, replay from lastSeq after a
// drop, and the wall view by share link.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest'
import { io } from 'socket.io-client'
import { baseUrl, Client } from '../support/client'
import { closeSockets, liveSocket, newLiveExercise, newPerson, ready, refused, until, type LiveCast, type LiveSocket } from '../support/live'

let cast: LiveCast
const url = (path: string) => `/api/exercises/${cast.id}${path}`
const facilitator = () => cast.facilitator.client
const keys = (s: LiveSocket) => s.events.filter(e => e.type === 'inject.released').map(e => e.data.key)

beforeAll(async () => {
  cast = await newLiveExercise('Realtime drill')
  await facilitator().post(url('/clock'), { action: 'start' })
  await facilitator().post(url('/clock'), { action: 'speed', factor: 1 })
})
afterEach(() => closeSockets())
afterAll(async () => {
  if (cast) await facilitator().post(url('/clock'), { action: 'end' })
})

describe('joining', () => {
  it('a member follows the exercise and is told its view and the clock', async () => {
    const s = liveSocket(cast.civil.client.cookieHeader, { exerciseId: cast.id })
    const r = await ready(s)
    expect(r).toMatchObject({ exerciseId: cast.id, view: 'player', teamKey: 'civil', clock: { status: 'running' } })
    expect(r.lastSeq).toBeGreaterThan(0)
  })

  it('a signed-in non-member is refused with "forbidden", an anonymous one with "unauthorized"', async () => {
    const outsider = await newPerson('Realtime outsider')
    expect(await refused(liveSocket(outsider.client.cookieHeader, { exerciseId: cast.id }))).toBe('forbidden')
    expect(await refused(liveSocket(
      outsider.client.cookieHeader,
      { exerciseId: '00000000-0000-4000-8000-000000000000' },
    ))).toBe('forbidden')
    expect(await refused(liveSocket(null, { exerciseId: cast.id }))).toBe('unauthorized')
    expect(await refused(liveSocket(outsider.client.cookieHeader, { exerciseId: 'nope' }))).toBe('invalid-auth')
  })

  it('a member without an exerciseId still connects, to its user room only', async () => {
    const s = liveSocket(cast.science.client.cookieHeader, {})
    await until(() => s.socket.connected, 5000, 'connect')
    await facilitator().post(url('/clock'), { action: 'speed', factor: 2 })
    await new Promise(r => setTimeout(r, 300))
    expect(s.events).toEqual([])
  })
})

describe('rooms', () => {
  it('each team hears its own injects only; staff hear all, with expected actions', async () => {
    const socks = Object.fromEntries((['science', 'civil', 'comms', 'evaluator', 'analyst', 'facilitator'] as const)
      .map(who => [who, liveSocket(cast[who].client.cookieHeader, { exerciseId: cast.id })])) as Record<string, LiveSocket>
    await Promise.all(Object.values(socks).map(ready))
    for (const key of ['survey-candidate', 'duty-officer-heads-up', 'blogger-risk-table']) {
      expect((await facilitator().post(url(`/injects/${key}/release`), { force: true })).status).toBe(201)
    }
    for (const who of ['evaluator', 'analyst', 'facilitator']) {
      await until(() => keys(socks[who]!).length >= 3, 5000, `${who} to hear three injects`)
      expect(socks[who]!.events.filter(e => e.type === 'inject.released').every(e => e.data.expectedActions.length > 0)).toBe(true)
    }
    await until(() => keys(socks.comms!).includes('blogger-risk-table'), 5000, 'comms')
    expect(keys(socks.science!)).toEqual(['survey-candidate'])
    expect(keys(socks.civil!)).toEqual(['duty-officer-heads-up'])
    expect(keys(socks.comms!)).toEqual(['blogger-risk-table'])
    for (const who of ['science', 'civil', 'comms']) {
      expect(JSON.stringify(socks[who]!.events)).not.toContain('expectedActions')
    }
    const facilitatorSeqs = socks.facilitator!.events.map(e => e.seq)
    expect(new Set(facilitatorSeqs).size).toBe(facilitatorSeqs.length)
  })
})

describe('replay', () => {
  it('a client that connects with lastSeq 0 gets its whole visible record, in order, before ready', async () => {
    const s = liveSocket(cast.science.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    const r = await ready(s)
    const record = (await cast.science.client.get(url('/events'))).json.events.map((e: { seq: number }) => e.seq)
    expect(s.events.map(e => e.seq)).toEqual(record)
    expect(r.lastSeq).toBeGreaterThanOrEqual(record.at(-1))
  })

  it('after a drop, a client resumes from its last seq and misses nothing, twice nothing', async () => {
    const first = liveSocket(cast.civil.client.cookieHeader, { exerciseId: cast.id })
    await ready(first)
    const seen = first.events.map(e => e.seq)
    const lastSeq = Math.max(...seen)
    first.socket.close()
    await facilitator().post(url('/injects/neighbour-region-coordination/release'), { force: true })
    await facilitator().post(url('/injects/survey-candidate/release'), { force: true })
    await facilitator().post(url('/clock'), { action: 'pause' })
    const again = liveSocket(cast.civil.client.cookieHeader, { exerciseId: cast.id, lastSeq })
    await ready(again)
    const missed = again.events.map(e => e.seq)
    expect(missed.every(seq => seq > lastSeq)).toBe(true)
    expect(again.events.map(e => e.type)).toEqual(['inject.released', 'clock.changed'])
    expect(again.events[0]!.data.key).toBe('neighbour-region-coordination')
    const record = (await cast.civil.client.get(url('/events'))).json.events.map((e: { seq: number }) => e.seq)
    expect([...seen, ...missed]).toEqual(record)
    await facilitator().post(url('/clock'), { action: 'resume' })
  })

  it('works over long-polling too', async () => {
    const s = io(baseUrl(), {
      path: '/socket.io/', transports: ['polling'], reconnection: false, forceNew: true,
      extraHeaders: { cookie: cast.comms.client.cookieHeader }, auth: { exerciseId: cast.id, lastSeq: 0 },
    })
    const got: number[] = []
    s.on('event', (e: { seq: number }) => got.push(e.seq))
    const r = await new Promise<{ view: string }>((ok, fail) => { s.on('live:ready', ok); s.on('connect_error', fail) })
    s.close()
    expect(r.view).toBe('player')
    expect(got.length).toBeGreaterThan(0)
  })
})

describe('the wall', () => {
  it('opens by share link without sign-in, hears only public traffic, and stops when revoked', async () => {
    const made = await facilitator().post(url('/wall-tokens'), { label: 'Plenary projector' })
    expect(made.status).toBe(201)
    expect(made.json.path).toBe(`/wall/${made.json.token}`)
    const list = await facilitator().get(url('/wall-tokens'))
    expect(JSON.stringify(list.json)).not.toContain(made.json.token)

    const anon = new Client()
    const snap = await anon.get(`/api/wall/${made.json.token}`)
    expect(snap.status).toBe(200)
    expect(snap.json).toMatchObject({ exercise: { id: cast.id }, drill: { marking: expect.stringMatching(/EXERCISE/) } })
    expect(JSON.stringify(snap.json)).not.toMatch(/expectedActions|"condition"/)

    const wall = liveSocket(null, { wallToken: made.json.token })
    const r = await ready(wall)
    expect(r.view).toBe('wall')
    expect(wall.events.some(e => e.type === 'clock.changed')).toBe(true)
    expect(wall.events.filter(e => e.type === 'inject.released')).toEqual([])

    await facilitator().post(url('/injects/precovery-release/release'), { force: true })
    await facilitator().post(url('/injects/observing-time-request/release'), { force: true })
    await facilitator().post(url('/solutions/s1-discovery/publish'))
    const sol = await until(() => wall.events.find(e => e.type === 'solution.published'), 10_000, 'solution at the wall')
    expect(sol.data.assessment).toBeUndefined()
    expect(sol.data.headline.text.impactProbability).toMatch(/%/)
    expect(sol.data.drill.marking).toMatch(/EXERCISE/)
    expect(keys(wall)).toEqual(['precovery-release'])
    expect(wall.events.find(e => e.type === 'inject.released')!.data.decision).toBeUndefined()
    const snap2 = await anon.get(`/api/wall/${made.json.token}`)
    expect(snap2.json.currentSolution.key).toBe('s1-discovery')
    expect(snap2.json.injects.map((i: { key: string }) => i.key)).toEqual(['precovery-release'])

    const revoke = await facilitator().delete(url(`/wall-tokens/${made.json.id}`))
    expect(revoke.status).toBe(204)
    await until(() => !wall.socket.connected, 5000, 'the wall to be disconnected')
    expect((await anon.get(`/api/wall/${made.json.token}`)).status).toBe(404)
    expect(await refused(liveSocket(null, { wallToken: made.json.token }))).toBe('forbidden')
    expect((await facilitator().delete(url(`/wall-tokens/${made.json.id}`))).status).toBe(404)
  })
})
