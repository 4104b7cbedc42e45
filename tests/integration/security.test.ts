// Security: the Content-Security-Policy of pages (inline scripts by hash only) and of the API; the
// session cookie's flags (Secure only behind HTTPS); cross-site request refusal on every unsafe
// method; single-use, expiring account tokens (expiry forced in the database); the password
// policy; the audit trail of admin actions. This file runs its own servers.
import { createHash } from 'node:crypto'
import Database from 'better-sqlite3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO } from '../support/client'
import { until } from '../support/live'
import { Http, TestServer } from '../support/test-server'

const server = new TestServer()
let admin: Http
let facilitator: Http

const db = () => new Database(server.dbPath)
/** The newest link mailed to an address (read from the fake SMTP catcher's table). */
/** The token of the latest mail to `email`, once there are at least `count` (reset mails go out after the answer). */
async function mailedToken(email: string, count = 1): Promise<string> {
  return until(() => {
    const d = db()
    try {
      const rows = d.prepare('select text from caught_mail where to_addr like ? order by created_at desc, rowid desc').all(`%${email}%`) as Array<{ text: string }>
      return rows.length >= count && /\/password\/([\w-]+)/.exec(rows[0]!.text)![1]!
    }
    finally { d.close() }
  }, 10_000, `mail ${count} to ${email}`)
}
async function invite(email: string) {
  const res = await admin.post('/api/admin/invitations', { email, name: 'Token Person' })
  expect(res.status).toBe(201)
  return mailedToken(email)
}
function countMail(email: string): number {
  const d = db()
  try { return (d.prepare('select count(*) as n from caught_mail where to_addr like ?').get(`%${email}%`) as { n: number }).n }
  finally { d.close() }
}

beforeAll(async () => {
  await server.init()
  await server.start()
  admin = await Http.signIn(server.base, DEMO.admin)
  facilitator = await Http.signIn(server.base, DEMO.facilitator)
}, 120_000)

afterAll(async () => {
  await server.dispose()
})

describe('Content-Security-Policy', () => {
  it('pages allow their own inline scripts by hash only, and nothing from elsewhere', async () => {
    for (const path of ['/signin', '/', '/exercises/00000000-0000-4000-8000-000000000000', '/no-such-page']) {
      const res = await fetch(`${server.base}${path}`, { headers: { cookie: facilitator.cookie, accept: 'text/html' } })
      expect(res.headers.get('content-type'), path).toMatch(/text\/html/)
      const html = await res.text()
      const csp = res.headers.get('content-security-policy')!
      expect(csp, path).toBeTruthy()
      const directives = Object.fromEntries(csp.split(';').map(d => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]))
      expect(directives['script-src']![0]).toBe(`'self'`)
      expect(directives['script-src']).not.toContain(`'unsafe-inline'`)
      expect(directives['script-src']).not.toContain(`'unsafe-eval'`)
      expect(directives['object-src']).toEqual([`'none'`])
      expect(directives['frame-ancestors']).toEqual([`'none'`])
      expect(directives['base-uri']).toEqual([`'self'`])
      expect(directives['form-action']).toEqual([`'self'`])
      expect(directives['connect-src']).toEqual([`'self'`, 'ws:', 'wss:'])
      expect(directives['img-src']).toEqual([`'self'`, 'data:', 'blob:'])
      // Every inline script of the page is allowed by its hash, and only those.
      const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)]
        .filter(m => !/\ssrc=/.test(m[1]!) && !/type="application\/json"/.test(m[1]!))
        .map(m => `'sha256-${createHash('sha256').update(m[2]!).digest('base64')}'`)
      expect(inline.length, path).toBeGreaterThan(0)
      expect(new Set(directives['script-src']!.slice(1))).toEqual(new Set(inline))
    }
  })

  it('API answers carry a policy too, and the other security headers', async () => {
    const res = await fetch(`${server.base}/api/health`)
    expect(res.headers.get('content-security-policy')).toMatch(/default-src 'self'.*frame-ancestors 'none'/)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
    expect(res.headers.get('cross-origin-opener-policy')).toBe('same-origin')
  })
})

describe('the session cookie', () => {
  const sessionCookie = async (base: string) => {
    const res = await fetch(`${base}/signin`)
    return res.headers.getSetCookie().find(c => c.startsWith('brinkwater-session='))!
  }

  it('is HttpOnly and SameSite=Lax, and not Secure over plain HTTP', async () => {
    const cookie = await sessionCookie(server.base)
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).not.toMatch(/;\s*Secure/i)
  })

  for (const env of [{ NUXT_SECURE_COOKIES: '1' }, { NUXT_APP_URL: 'https://drills.example.org' }] as Array<Record<string, string>>) {
    it(`is Secure with ${Object.entries(env).map(([k, v]) => `${k}=${v}`).join(' ')}`, async () => {
      const https = new TestServer({ seed: false, env, stderr: 'ignore' })
      await https.init()
      try {
        await https.start()
        const cookie = await sessionCookie(https.base)
        expect(cookie).toMatch(/;\s*Secure/i)
        expect(cookie).toMatch(/HttpOnly/i)
      }
      finally { await https.dispose() }
    }, 60_000)
  }
})

describe('cross-site requests', () => {
  const attacks: Array<[string, Record<string, string> | (() => Record<string, string>)]> = [
    ['another origin', { origin: 'https://evil.example' }],
    ['a look-alike origin', () => ({ origin: `${server.base}.evil.example` })],
    ['an origin on another port', { origin: 'http://127.0.0.1:1' }],
    ['the null origin (sandboxed frame, data: URL)', { origin: 'null' }],
    ['a malformed origin', { origin: 'not a url' }],
    ['Sec-Fetch-Site cross-site', { 'sec-fetch-site': 'cross-site' }],
    ['Sec-Fetch-Site same-site (a sibling subdomain)', { 'sec-fetch-site': 'same-site' }],
    ['a forged X-Forwarded-Host without a trusted proxy', { 'origin': 'https://evil.example', 'x-forwarded-host': 'evil.example' }],
  ]
  const targets: Array<[string, string, unknown]> = [
    ['POST', '/api/admin/invitations', { email: 'csrf@example.test', name: 'CSRF' }],
    ['POST', '/api/auth/logout', {}],
    ['PUT', '/api/scenarios/00000000-0000-4000-8000-000000000000', { revision: 1, document: {} }],
    ['PATCH', '/api/exercises/00000000-0000-4000-8000-000000000000/members/00000000-0000-4000-8000-000000000000', { role: 'evaluator' }],
    ['DELETE', '/api/scenarios/00000000-0000-4000-8000-000000000000', undefined],
  ]
  for (const [what, headers] of attacks) {
    it(`refuses every unsafe method from ${what}`, async () => {
      for (const [method, path, body] of targets) {
        const res = await admin.call(method, path, body, typeof headers === 'function' ? headers() : headers)
        expect(res.status, `${method} ${path}`).toBe(403)
        expect(res.json.message).toBe('Cross-site request refused.')
      }
      const users = (await admin.get('/api/admin/users')).json.map((u: { email: string }) => u.email)
      expect(users).not.toContain('csrf@example.test')
    })
  }

  it('lets same-origin requests and safe methods through', async () => {
    const same = await admin.call('GET', '/api/admin/users', undefined, { 'origin': 'https://evil.example', 'sec-fetch-site': 'cross-site' })
    expect(same.status).toBe(200)
    const ok = await admin.call(
      'POST',
      '/api/auth/forgot',
      { email: 'nobody@example.test' },
      { 'origin': server.base, 'sec-fetch-site': 'same-origin' },
    )
    expect(ok.status).toBe(202)
    const typed = await admin.call('POST', '/api/auth/forgot', { email: 'nobody@example.test' }, { 'sec-fetch-site': 'none' })
    expect(typed.status).toBe(202)
  })

  it('a form a hostile page could post (text/plain, urlencoded) is refused even without Origin', async () => {
    for (const type of ['text/plain', 'application/x-www-form-urlencoded']) {
      const res = await admin.call(
        'POST',
        '/api/admin/invitations',
        JSON.stringify({ email: 'form@example.test', name: 'Form' }),
        { 'content-type': type },
      )
      expect(res.status, type).toBe(415)
    }
  })
})

describe('account tokens', () => {
  it('are single-use: a link works once', async () => {
    const token = await invite('once@example.test')
    const first = await new Http(server.base).post('/api/auth/password', { token, password: 'a-long-test-password' })
    expect(first.status).toBe(200)
    const again = await new Http(server.base).post('/api/auth/password', { token, password: 'another-long-password' })
    expect(again.status).toBe(400)
    expect(again.json.message).toMatch(/invalid or has expired/)
    // The first password stands.
    expect((await Http.signIn(server.base, 'once@example.test', 'a-long-test-password')).cookie).toBeTruthy()
  })

  it('expire: a link past its expiry is refused with the same message, and stays unused', async () => {
    const token = await invite('late@example.test')
    const hash = createHash('sha256').update(token).digest('hex')
    const d = db()
    const changed = d.prepare('update account_tokens set expires_at = ? where token_hash = ?').run(Date.now() - 1000, hash).changes
    d.close()
    expect(changed).toBe(1)
    const res = await new Http(server.base).post('/api/auth/password', { token, password: 'a-long-test-password' })
    expect(res.status).toBe(400)
    expect(res.json.message).toMatch(/invalid or has expired/)
    const d2 = db()
    const row = d2.prepare('select used_at from account_tokens where token_hash = ?').get(hash) as { used_at: number | null }
    d2.close()
    expect(row.used_at).toBeNull()
  })

  it('a new reset link voids the earlier one, and only hashes are stored', async () => {
    const before = countMail(DEMO.comms)
    await new Http(server.base).post('/api/auth/forgot', { email: DEMO.comms })
    const first = await mailedToken(DEMO.comms, before + 1)
    await new Http(server.base).post('/api/auth/forgot', { email: DEMO.comms })
    const second = await mailedToken(DEMO.comms, before + 2)
    expect(second).not.toBe(first)
    expect((await new Http(server.base).post('/api/auth/password', { token: first, password: 'a-long-test-password' })).status).toBe(400)
    const d = db()
    const stored = (d.prepare('select token_hash from account_tokens').all() as Array<{ token_hash: string }>).map(r => r.token_hash)
    d.close()
    expect(stored).not.toContain(second)
    expect(stored).toContain(createHash('sha256').update(second).digest('hex'))
  })
})

describe('the password policy', () => {
  it('refuses short, long and common passwords without spending the link', async () => {
    const token = await invite('policy@example.test')
    for (const password of ['short', '123456789', 'a'.repeat(201), 'password123', 'Brinkwater', 'CHANGEME123']) {
      const res = await new Http(server.base).post('/api/auth/password', { token, password })
      expect(res.status, password).toBe(400)
      expect(res.json.data.issues[0].path).toBe('password')
    }
    expect((await new Http(server.base).post('/api/auth/password', { token, password: 'ten chars!' })).status).toBe(200)
  })
})

describe('the audit trail', () => {
  it('records admin actions with who did them, and only admins read it', async () => {
    await admin.post('/api/admin/invitations', { email: 'audited@example.test', name: 'Audited' })
    const backup = await fetch(`${server.base}/api/admin/backup`, { headers: { cookie: admin.cookie } })
    await backup.arrayBuffer()
    const trail = await admin.get('/api/admin/audit?limit=50')
    expect(trail.status).toBe(200)
    const actions = trail.json.map((e: { action: string }) => e.action)
    expect(actions).toContain('user.invite')
    expect(actions).toContain('admin.backup')
    const invited = trail.json.find((e: {
      action: string
      data: { email?: string }
    }) => e.action === 'user.invite' && e.data.email === 'audited@example.test')
    expect(invited.actor.email).toBe(DEMO.admin)
    expect(Date.parse(trail.json[0].createdAt)).toBeGreaterThanOrEqual(Date.parse(trail.json.at(-1).createdAt))
    const filtered = await admin.get('/api/admin/audit?action=admin.backup')
    expect(filtered.json.every((e: { action: string }) => e.action === 'admin.backup')).toBe(true)
    expect((await admin.get('/api/admin/audit?limit=0')).status).toBe(400)
    expect((await facilitator.get('/api/admin/audit')).status).toBe(403)
    expect((await new Http(server.base).get('/api/admin/audit')).status).toBe(401)
  })
})
