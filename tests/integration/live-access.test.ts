// The live routes against every role: anonymous → 401, non-member → 404, another role → 403, the
// allowed roles get through to validation (400 with field issues) or an answer.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, Client } from '../support/client'
import { ikey, newLiveExercise, newPerson, type LiveCast, type Person } from '../support/live'

type Who = 'facilitator' | 'science' | 'evaluator' | 'analyst'
interface Route { name: string; method: 'GET' | 'POST' | 'DELETE'; path: string; body?: unknown; allowed: Who[]; badField?: string }

let cast: LiveCast
let outsider: Person

const ROUTES: Route[] = [
  { name: 'clock', method: 'POST', path: '/clock', body: { action: 'warp' }, allowed: ['facilitator'], badField: 'action' },
  { name: 'release', method: 'POST', path: '/injects/Not_A_Key/release', allowed: ['facilitator'], badField: 'key' },
  { name: 'hold', method: 'POST', path: '/injects/Not_A_Key/hold', allowed: ['facilitator'], badField: 'key' },
  { name: 'publish', method: 'POST', path: '/solutions/Not_A_Key/publish', allowed: ['facilitator'], badField: 'key' },
  {
    name: 'messages',
    method: 'POST',
    path: '/messages',
    // An empty message: the facilitator's to no team, a player's to control (players write to control since issue 14).
    body: { teams: [], title: 'x', body: '', idempotencyKey: 'k-12345678' },
    allowed: ['facilitator', 'science'],
    badField: 'body',
  },
  {
    name: 'responses',
    method: 'POST',
    path: '/responses',
    body: { injectKey: 'survey-candidate', text: 'x' },
    allowed: ['science'],
    badField: 'idempotencyKey',
  },
  {
    name: 'scores',
    method: 'POST',
    path: '/scores',
    body: { criterionKey: 'figures-of-record', taskKey: 'x', rating: 'A', idempotencyKey: 'k-12345678' },
    allowed: ['evaluator', 'facilitator'],
    badField: 'rating',
  },
  {
    name: 'observations',
    method: 'POST',
    path: '/observations',
    body: { text: '', idempotencyKey: 'k-12345678' },
    allowed: ['evaluator', 'facilitator'],
    badField: 'text',
  },
  { name: 'wall-tokens create', method: 'POST', path: '/wall-tokens', body: { label: 42 }, allowed: ['facilitator'], badField: 'label' },
  { name: 'wall-tokens revoke', method: 'DELETE', path: '/wall-tokens/not-a-uuid', allowed: ['facilitator'], badField: 'tokenId' },
  { name: 'wall-tokens list', method: 'GET', path: '/wall-tokens', allowed: ['facilitator'] },
  {
    name: 'events',
    method: 'GET',
    path: '/events?since=-1',
    allowed: ['facilitator', 'science', 'evaluator', 'analyst'],
    badField: 'since',
  },
  { name: 'live', method: 'GET', path: '/live', allowed: ['facilitator', 'science', 'evaluator', 'analyst'] },
]

const call = (c: Client, r: Route, exerciseId: string) => c.request(
  r.method,
  `/api/exercises/${exerciseId}${r.path}`,
  r.method === 'POST' ? (r.body ?? {}) : undefined,
)

beforeAll(async () => {
  cast = await newLiveExercise('Access matrix drill')
  outsider = await newPerson('Outsider')
})

afterAll(async () => {
  if (cast) await cast.facilitator.client.post(`/api/exercises/${cast.id}/clock`, { action: 'end' })
})

describe.each(ROUTES)('$method $name', (r) => {
  it('anonymous → 401, even with a malformed exercise id', async () => {
    expect((await call(new Client(), r, cast.id)).status).toBe(401)
    expect((await call(new Client(), r, 'not-a-uuid')).status).toBe(401)
  })

  it('a signed-in non-member → 404, the same as for no such exercise', async () => {
    expect((await call(outsider.client, r, cast.id)).status).toBe(404)
    expect((await call(outsider.client, r, '00000000-0000-4000-8000-000000000000')).status).toBe(404)
  })

  it('a malformed exercise id → 400 on id', async () => {
    const res = await call(cast.facilitator.client, r, 'not-a-uuid')
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].path).toBe('id')
  })

  for (const who of ['facilitator', 'science', 'evaluator', 'analyst'] as const) {
    const allowed = r.allowed.includes(who)
    it(`${who} → ${allowed ? (r.badField ? `400 on ${r.badField}` : '200') : '403'}`, async () => {
      const res = await call(cast[who].client, r, cast.id)
      if (!allowed) return expect(res.status).toBe(403)
      if (!r.badField) return expect(res.status).toBe(200)
      expect(res.status).toBe(400)
      expect(res.json.data.issues.map((i: { path: string }) => i.path)).toContain(r.badField)
    })
  }
})

describe('admins without a drill role', () => {
  it('read the live desk and events as evaluators, but may not write (404)', async () => {
    const admin = await as('admin')
    const desk = await admin.get(`/api/exercises/${cast.id}/live`)
    expect(desk.status).toBe(200)
    expect(desk.json.view).toBe('evaluator')
    expect((await admin.post(`/api/exercises/${cast.id}/clock`, { action: 'start' })).status).toBe(404)
  })
})

describe('field issues', () => {
  const post = (who: Who, path: string, body: unknown) => cast[who].client.post(`/api/exercises/${cast.id}${path}`, body)
  const paths = (res: { json: { data: { issues: Array<{ path: string }> } } }) => res.json.data.issues.map(i => i.path)

  it('speed without a factor, jump without a target, a factor beyond the limits', async () => {
    expect(paths(await post('facilitator', '/clock', { action: 'speed' }))).toEqual(['factor'])
    expect(paths(await post('facilitator', '/clock', { action: 'jump' }))).toEqual(['to'])
    expect(paths(await post('facilitator', '/clock', { action: 'jump', to: 'tomorrow' }))).toContain('to')
    expect(paths(await post('facilitator', '/clock', { action: 'speed', factor: 0.5 }))).toEqual(['factor'])
  })

  it('a message to an unknown team, of an unknown kind, with a misspelt hazard field', async () => {
    const res = await post(
      'facilitator',
      '/messages',
      { teams: ['science', 'ops'], kind: 'telegram', title: 'T', body: 'Energy {{ energyMT }}', idempotencyKey: ikey() },
    )
    expect(res.status).toBe(400)
    expect(paths(res)).toEqual(['teams[1]', 'kind', 'body'])
    expect(res.json.data.issues[2].message).toMatch(/energyMt/)
  })

  it('a score for an unknown criterion or task', async () => {
    expect(paths(await post(
      'evaluator',
      '/scores',
      { criterionKey: 'nope', taskKey: 'notify-early', rating: 'P', idempotencyKey: ikey() },
    ))).toEqual(['criterionKey'])
    expect(paths(await post(
      'evaluator',
      '/scores',
      { criterionKey: 'notification-and-coordination', taskKey: 'nope', rating: 'P', idempotencyKey: ikey() },
    ))).toEqual(['taskKey'])
  })

  it('a response with neither choice nor text, and an observation about an unknown team', async () => {
    expect(paths(await post('science', '/responses', { injectKey: 'survey-candidate', idempotencyKey: ikey() }))).toEqual(['text'])
    expect(paths(await post('evaluator', '/observations', { text: 'x', teamKey: 'ops', idempotencyKey: ikey() }))).toEqual(['teamKey'])
  })

  it('an unknown inject or solution key → 404; a response to an inject not yet released → 404', async () => {
    expect((await post('facilitator', '/injects/no-such-inject/release', {})).status).toBe(404)
    expect((await post('facilitator', '/solutions/no-such-solution/publish', {})).status).toBe(404)
    expect((await post('science', '/responses', { injectKey: 'survey-candidate', text: 'x', idempotencyKey: ikey() })).status).toBe(404)
  })
})
