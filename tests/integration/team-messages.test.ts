// Players talk back: a team writes to control (the cell that plays outside agencies, the press, the public), or to
// another team through control. Control and the evaluators read it live; the team sees what it sent; no other team
// does; the timeline and exports carry it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, ikey, liveSocket, newLiveExercise, ready, until, type LiveCast } from '../support/live'

let cast: LiveCast
const url = (p = '') => `/api/exercises/${cast.id}${p}`
const types = async (who: LiveCast['science']) =>
  ((await who.client.get(url('/events'))).json.events as Array<{ type: string; data: { body?: string } }>)

beforeAll(async () => { cast = await newLiveExercise('Team messages drill') }, 60_000)
afterAll(() => closeSockets())

describe('messages from the teams', () => {
  it('reach control live and the evaluators, stay with the sending team, and no other team reads them', async () => {
    const control = liveSocket(cast.facilitator.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    await ready(control)
    const body = 'Harbour master asks whether to close the port tonight. Please advise.'
    const sent = await cast.civil.client.post(url('/messages'), { to: 'control', body, idempotencyKey: ikey() })
    expect(sent.status).toBe(201)
    expect(sent.json.event.data).toMatchObject({ from: 'civil', to: 'control', body })
    const heard = await until(() => control.events.find(e => e.type === 'team.message'), 5000, 'team message on the control socket')
    expect(heard.data.body).toBe(body)
    expect((await types(cast.civil)).some(e => e.type === 'team.message' && e.data.body === body)).toBe(true)
    expect((await types(cast.evaluator)).some(e => e.type === 'team.message')).toBe(true)
    expect((await types(cast.science)).some(e => e.type === 'team.message')).toBe(false)
    // Control's desk snapshot lists it.
    expect((await cast.facilitator.client.get(url('/live'))).json.teamMessages.map((m: { body: string }) => m.body)).toContain(body)
  })

  it('go to another team only through control, are sent once per key, and refuse a bad address or an outsider', async () => {
    const key = ikey()
    const first = await cast.science.client.post(url('/messages'), { to: 'comms', body: 'Send us the press lines before 14:00.', idempotencyKey: key })
    const again = await cast.science.client.post(url('/messages'), { to: 'comms', body: 'Send us the press lines before 14:00.', idempotencyKey: key })
    expect([first.status, again.status]).toEqual([201, 200])
    expect(again.json.event.seq).toBe(first.json.event.seq)
    // Comms does not read it directly: control passes it on.
    expect((await types(cast.comms)).some(e => e.type === 'team.message')).toBe(false)
    expect((await cast.science.client.post(url('/messages'), { to: 'science', body: 'To ourselves', idempotencyKey: ikey() })).status).toBe(400)
    expect((await cast.science.client.post(url('/messages'), { to: 'nobody', body: 'Lost', idempotencyKey: ikey() })).status).toBe(400)
    expect((await cast.evaluator.client.post(url('/messages'), { to: 'control', body: 'Not a team', idempotencyKey: ikey() })).status).toBe(403)
  })

  it('appear in the timeline and its exports', async () => {
    const csv = (await cast.facilitator.client.get(url('/timeline.csv'))).text
    expect(csv).toContain('Message from')
    expect(csv).toContain('Harbour master asks whether to close the port tonight')
  })
})
