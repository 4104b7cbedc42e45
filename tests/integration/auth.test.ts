import { describe, expect, it } from 'vitest'
import { as, Client, DEMO, DEMO_PASSWORD, mailTo, newMember } from '../support/client'
import { until } from '../support/live'

describe('sign-in', () => {
  it('signs in with e-mail and password, reports the user, and signs out', async () => {
    const c = new Client()
    const res = await c.post('/api/auth/login', { email: DEMO.facilitator, password: DEMO_PASSWORD })
    expect(res.status).toBe(200)
    expect(res.json.user).toMatchObject({ email: DEMO.facilitator, systemRole: 'member' })
    expect(res.json.user.passwordHash).toBeUndefined()
    const me = await c.get('/api/me')
    expect(me.status).toBe(200)
    const demo = me.json.memberships.find((m: { title: string }) => m.title.startsWith('Demo drill'))
    expect(demo).toMatchObject({ role: 'facilitator' })
    expect((await c.post('/api/auth/logout')).status).toBe(200)
    expect((await c.get('/api/me')).status).toBe(401)
  })

  it('treats the e-mail case-insensitively', async () => {
    const c = new Client()
    expect((await c.post('/api/auth/login', { email: DEMO.analyst.toUpperCase(), password: DEMO_PASSWORD })).status).toBe(200)
  })

  it('answers one vague message for an unknown address and for a wrong password', async () => {
    const unknown = await new Client().post('/api/auth/login', { email: 'nobody@brinkwater.test', password: 'whatever-it-is' })
    const wrong = await new Client().post('/api/auth/login', { email: DEMO.comms, password: 'not-the-password' })
    expect(unknown.status).toBe(401)
    expect(wrong.status).toBe(401)
    expect(unknown.json.message).toBe(wrong.json.message)
    expect(wrong.text).not.toMatch(/stack|at .*\.mjs/)
  })

  it('gives field-level issues for a bad body, never a stack trace', async () => {
    const res = await new Client().post('/api/auth/login', { email: 'not-an-address' })
    expect(res.status).toBe(400)
    const paths = res.json.data.issues.map((i: { path: string }) => i.path)
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']))
    expect(res.text).not.toMatch(/\.mjs:\d+/)
    const broken = await new Client().request('POST', '/api/auth/login', '{"email": ', { 'content-type': 'application/json' })
    expect(broken.status).toBe(400)
  })

  it('locks an account and address out after five failures with 429 and Retry-After', async () => {
    const { email } = await newMember('Lockout Person')
    const c = new Client()
    for (let i = 0; i < 5; i++) {
      expect((await c.post('/api/auth/login', { email, password: `wrong-password-${i}` })).status).toBe(401)
    }
    const locked = await c.post('/api/auth/login', { email, password: 'a-long-test-password' })
    expect(locked.status).toBe(429)
    expect(Number(locked.headers.get('retry-after'))).toBeGreaterThan(60)
    // Other accounts from the same address still sign in.
    expect((await new Client().post('/api/auth/login', { email: DEMO.evaluator, password: DEMO_PASSWORD })).status).toBe(200)
  })
})

describe('accounts by e-mail', () => {
  it('an invitation is mailed, its link sets a password once, and the password signs in', async () => {
    const admin = await as('admin')
    const email = 'new.planner@example.test'
    const inv = await admin.post('/api/admin/invitations', { email, name: 'New Planner' })
    expect(inv.status).toBe(201)
    const mails = await mailTo(email)
    expect(mails).toHaveLength(1)
    expect(mails[0]!.subject).toMatch(/invited/i)
    const link = /(http\S+\/password\/([\w-]+)\?welcome=1)/.exec(mails[0]!.text)
    expect(link).not.toBeNull()
    const token = link![2]!

    // Too short a password is refused with a field issue and does not spend the token.
    const weak = await new Client().post('/api/auth/password', { token, password: 'short' })
    expect(weak.status).toBe(400)
    expect(weak.json.data.issues[0].path).toBe('password')

    const person = new Client()
    const set = await person.post('/api/auth/password', { token, password: 'correct horse battery' })
    expect(set.status).toBe(200)
    expect((await person.get('/api/me')).json.user.email).toBe(email)

    const again = await new Client().post('/api/auth/password', { token, password: 'another long password' })
    expect(again.status).toBe(400)

    expect((await new Client().post('/api/auth/login', { email, password: 'correct horse battery' })).status).toBe(200)
    // Inviting an address that already has an account is a conflict on the e-mail field.
    const dup = await admin.post('/api/admin/invitations', { email, name: 'Again' })
    expect(dup.status).toBe(409)
  })

  it('a forgotten password is reset through a mailed link; unknown addresses get the same answer', async () => {
    const { email } = await newMember('Forgetful Person')
    const known = await new Client().post('/api/auth/forgot', { email })
    const unknown = await new Client().post('/api/auth/forgot', { email: 'ghost@example.test' })
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    expect(known.json).toEqual(unknown.json)
    // The mail goes out after the answer.
    const mail = await until(async () => (await mailTo(email)).find(m => /reset/i.test(m.subject)), 10_000, 'reset mail')
    const token = /\/password\/([\w-]+)/.exec(mail!.text)![1]!
    expect((await new Client().post('/api/auth/password', { token, password: 'my brand new password' })).status).toBe(200)
    expect((await new Client().post('/api/auth/login', { email, password: 'my brand new password' })).status).toBe(200)
    expect((await new Client().post('/api/auth/login', { email, password: 'a-long-test-password' })).status).toBe(401)
    expect(await mailTo('ghost@example.test')).toHaveLength(0)
  })
})
