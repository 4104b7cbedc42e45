import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { freePort } from '../support/ports'
import { as, baseUrl, Client, DEMO, DEMO_PASSWORD } from '../support/client'

describe('security headers and cross-site requests', () => {
  it('every answer carries the security headers', async () => {
    const res = await new Client().get('/api/health')
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
    expect(res.headers.get('referrer-policy')).toBe('same-origin')
    const page = await fetch(`${baseUrl()}/signin`)
    expect(page.headers.get('x-frame-options')).toBe('DENY')
  })

  it('refuses a state-changing request from another site, even with a valid session', async () => {
    const c = await as('admin')
    const evil = await c.request('POST', '/api/admin/invitations', { email: 'csrf@example.test', name: 'CSRF' }, { origin: 'https://evil.example' })
    expect(evil.status).toBe(403)
    const crossSite = await c.request(
      'POST',
      '/api/admin/invitations',
      { email: 'csrf@example.test', name: 'CSRF' },
      { 'sec-fetch-site': 'cross-site' },
    )
    expect(crossSite.status).toBe(403)
    const users = (await c.get('/api/admin/users')).json.map((u: { email: string }) => u.email)
    expect(users).not.toContain('csrf@example.test')
    const same = await c.request(
      'POST',
      '/api/auth/forgot',
      { email: 'x@example.test' },
      { 'origin': baseUrl(), 'sec-fetch-site': 'same-origin' },
    )
    expect(same.status).toBe(202)
  })

  it('the session cookie is HttpOnly and SameSite=Lax, and a new sign-in gets a new session', async () => {
    const res = await fetch(
      `${baseUrl()}/api/auth/login`,
      {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: DEMO.analyst, password: DEMO_PASSWORD }),
      },
    )
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('brinkwater-session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    const first = cookie.split(';')[0]!
    const sessionId = async (c: string) => ((await (await fetch(
      `${baseUrl()}/api/_auth/session`,
      { headers: { cookie: c } },
    )).json()) as { id?: string }).id
    const firstId = await sessionId(first)
    expect(firstId).toBeTruthy()
    const again = await fetch(
      `${baseUrl()}/api/auth/login`,
      {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'cookie': first },
        body: JSON.stringify({ email: DEMO.analyst, password: DEMO_PASSWORD }),
      },
    )
    const second = again.headers.getSetCookie().find(c => c.startsWith('brinkwater-session='))!.split(';')[0]!
    expect(await sessionId(second)).not.toBe(firstId)
  })
})

describe('backups', () => {
  it('only admins download a backup', async () => {
    expect((await new Client().get('/api/admin/backup')).status).toBe(401)
    expect((await (await as('facilitator')).get('/api/admin/backup')).status).toBe(403)
  })

  it('an admin downloads a consistent backup, and a fresh server restored from it holds the drill', async () => {
    const admin = await as('admin')
    const res = await fetch(`${baseUrl()}/api/admin/backup`, { headers: { cookie: admin.cookieHeader } })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-disposition')).toMatch(/brinkwater-.*\.sqlite/)
    const bytes = new Uint8Array(await res.arrayBuffer())
    expect(new TextDecoder().decode(bytes.slice(0, 15))).toBe('SQLite format 3')

    const dir = mkdtempSync(join(tmpdir(), 'brinkwater-restore-'))
    writeFileSync(join(dir, 'restored.sqlite'), bytes)
    const [port, smtp] = [await freePort(), await freePort()]
    const entry = resolve(import.meta.dirname, '../..', process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')
    const server = spawn(process.execPath, [entry], {
      env: {
        ...process.env,
        PORT: String(port),
        HOST: '127.0.0.1',
        NUXT_DB_PATH: join(dir, 'restored.sqlite'),
        NUXT_SEED_DEMO: '',
        NUXT_FAKE_SMTP_PORT: String(smtp),
        NUXT_SESSION_PASSWORD: 'restore-test-session-password-0123456789abcdef',
      },
      stdio: 'ignore',
    })
    try {
      const url = `http://127.0.0.1:${port}`
      for (let i = 0; i < 150; i++) {
        try { if ((await fetch(`${url}/api/health`)).ok) break }
        catch { /* starting */ }
        await new Promise(r => setTimeout(r, 200))
      }
      const login = await fetch(
        `${url}/api/auth/login`,
        {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ email: DEMO.facilitator, password: DEMO_PASSWORD }),
        },
      )
      expect(login.status).toBe(200)
      const cookie = login.headers.getSetCookie()[0]!.split(';')[0]!
      const list = await (await fetch(`${url}/api/exercises`, { headers: { cookie } })).json() as Array<{ title: string }>
      expect(list.map(e => e.title)).toContain('Demo drill — Gannet ocean impact off the Western Shore')
      const scenarios = await (await fetch(`${url}/api/scenarios`, { headers: { cookie } })).json() as Array<{ key: string }>
      expect(scenarios.map(s => s.key)).toContain('demo-ocean-impact')
    }
    finally {
      server.kill('SIGTERM')
      await new Promise(r => server.once('exit', r))
      rmSync(dir, { recursive: true, force: true })
    }
  })
})
