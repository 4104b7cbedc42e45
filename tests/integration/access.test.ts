// Every route against every role: anonymous → 401, signed in but not allowed → 403 (or 404
// where the existence of an exercise must not leak).
import { beforeAll, describe, expect, it } from 'vitest'
import { as, Client, newMember, type DemoKey } from '../support/client'

const ALL: DemoKey[] = ['admin', 'facilitator', 'science', 'civil', 'comms', 'evaluator', 'analyst']
let exerciseId = ''
let outsider: Client

beforeAll(async () => {
  const list = await (await as('facilitator')).get('/api/exercises')
  exerciseId = list.json.find((e: { title: string }) => e.title.startsWith('Demo drill')).exerciseId
  outsider = (await newMember('Outsider')).client
})

describe('open routes', () => {
  it('health answers anonymously', async () => {
    const res = await new Client().get('/api/health')
    expect(res.status).toBe(200)
    expect(res.json.status).toBe('ok')
  })
})

describe('signed-in routes refuse anonymous callers', () => {
  for (const path of ['/api/me', '/api/exercises', '/api/admin/users', '/api/dev/mailbox']) {
    it(`GET ${path} → 401`, async () => {
      expect((await new Client().get(path)).status).toBe(401)
    })
  }
  it('GET /api/exercises/:id → 401', async () => {
    expect((await new Client().get(`/api/exercises/${exerciseId}`)).status).toBe(401)
  })
  it('POST /api/admin/invitations → 401', async () => {
    expect((await new Client().post('/api/admin/invitations', { email: 'x@example.test', name: 'X' })).status).toBe(401)
  })
})

describe('admin routes', () => {
  for (const who of ALL) {
    const allowed = who === 'admin'
    it(`${who}: users list ${allowed ? '200' : '403'}, invitation ${allowed ? 'validated' : '403'}, mailbox ${allowed ? '200' : '403'}`, async () => {
      const c = await as(who)
      const users = await c.get('/api/admin/users')
      expect(users.status).toBe(allowed ? 200 : 403)
      if (allowed) expect(users.json.map((u: { email: string }) => u.email)).toContain('science@brinkwater.test')
      if (allowed) expect(JSON.stringify(users.json)).not.toMatch(/passwordHash|\$scrypt/)
      const inv = await c.post('/api/admin/invitations', { email: 'bad' })
      expect(inv.status).toBe(allowed ? 400 : 403)
      expect((await c.get('/api/dev/mailbox')).status).toBe(allowed ? 200 : 403)
    })
  }
})

describe('exercise routes', () => {
  for (const who of ALL) {
    it(`${who} sees the demo exercise with the right role`, async () => {
      const c = await as(who)
      const list = await c.get('/api/exercises')
      expect(list.status).toBe(200)
      if (who === 'admin') {
        expect(list.json).toHaveLength(0)
      }
      else {
        const demo = list.json.find((e: { exerciseId: string }) => e.exerciseId === exerciseId)
        const expected = ['science', 'civil', 'comms'].includes(who) ? 'player' : who
        expect(demo.role).toBe(expected)
      }
      const one = await c.get(`/api/exercises/${exerciseId}`)
      expect(one.status).toBe(200)
      expect(one.json.members.length).toBe(6)
    })
  }

  it('a signed-in non-member gets 404, the same as for an exercise that does not exist', async () => {
    expect((await outsider.get(`/api/exercises/${exerciseId}`)).status).toBe(404)
    expect((await outsider.get('/api/exercises/00000000-0000-4000-8000-000000000000')).status).toBe(404)
    expect((await outsider.get('/api/exercises')).json).toEqual([])
  })

  it('a malformed id is a 400 with a field issue', async () => {
    const res = await (await as('facilitator')).get('/api/exercises/not-a-uuid')
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].path).toBe('id')
  })
})
