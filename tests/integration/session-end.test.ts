// Sessions end when they should: a signed-out cookie opens nothing (before, a copy stayed good for up to 12 h), and a
// password reset ends every session of the account, for HTTP and for the live socket's handshake.
import { afterAll, describe, expect, it } from 'vitest'
import { Client, mailTo } from '../support/client'
import { closeSockets, liveSocket, newPerson, refused, until } from '../support/live'

afterAll(() => closeSockets())

/** A second client holding a copy of the first one's cookies (a stolen or forgotten cookie). */
function copyOf(c: Client): Client {
  const copy = new Client()
  for (const [k, v] of c.cookies) copy.cookies.set(k, v)
  return copy
}

describe('sessions end when they should', () => {
  it('refuses a signed-out session\'s cookie (401), over HTTP and at the socket handshake', async () => {
    const p = await newPerson('Sign-out test')
    const kept = copyOf(p.client)
    expect((await kept.get('/api/exercises')).status).toBe(200)
    expect((await p.client.post('/api/auth/logout')).status).toBe(200)
    expect((await kept.get('/api/exercises')).status).toBe(401)
    const s = liveSocket(kept.cookieHeader, {})
    expect(await refused(s)).toBe('unauthorized')
  })

  it('ends only the session that signed out: another device stays signed in', async () => {
    const p = await newPerson('Two devices')
    const other = new Client()
    await other.login(p.email, 'a-long-test-password')
    expect((await p.client.post('/api/auth/logout')).status).toBe(200)
    expect((await other.get('/api/exercises')).status).toBe(200)
  })

  it('ends every session of an account when its password is reset', async () => {
    const p = await newPerson('Reset test')
    const laptop = new Client()
    await laptop.login(p.email, 'a-long-test-password')
    const phone = copyOf(p.client)
    const forgot = await new Client().post('/api/auth/forgot', { email: p.email })
    expect(forgot.status).toBeLessThan(300)
    const mail = await until(async () => (await mailTo(p.email)).find(m => /reset|password/i.test(m.subject ?? m.text)), 10_000, 'reset mail')
    const token = /\/password\/([\w-]+)/.exec(mail.text)![1]!
    const fresh = new Client()
    expect((await fresh.post('/api/auth/password', { token, password: 'another-long-password' })).status).toBe(200)
    expect((await laptop.get('/api/exercises')).status).toBe(401)
    expect((await phone.get('/api/exercises')).status).toBe(401)
    expect(await refused(liveSocket(laptop.cookieHeader, {}))).toBe('unauthorized')
    // The session opened by the reset itself is alive.
    expect((await fresh.get('/api/exercises')).status).toBe(200)
  })
})
