// Stored mail and backups hold no working account link: before, the local mailbox and every backup kept the
// invitation and reset links, with which an admin could set the password of anyone's account.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import Database from 'better-sqlite3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { until } from '../support/live'
import { Http, TestServer } from '../support/test-server'

let server: TestServer
let admin: Http
let dir: string
type Mail = { to: string; subject: string; text: string; html: string | null }

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'bw-mail-links-'))
  // The default: no NUXT_MAILBOX_LINKS.
  server = await new TestServer({ stderr: 'ignore', env: { NUXT_MAILBOX_LINKS: '' } }).init()
  await server.start()
  admin = await Http.signIn(server.base, 'admin@brinkwater.test')
}, 90_000)
afterAll(async () => {
  await server?.dispose()
  rmSync(dir, { recursive: true, force: true })
})

const mailbox = async () => (await admin.get('/api/dev/mailbox')).json as Mail[]
const TOKEN_LINK = /\/password\/[A-Za-z0-9_-]{16,}/

describe('account links in stored mail', () => {
  it('shows that an invitation and a reset link were sent, not the links', async () => {
    expect((await admin.post('/api/admin/invitations', { email: 'newcomer@example.test', name: 'New Comer' })).status).toBe(201)
    await fetch(`${server.base}/api/auth/forgot`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'analyst@brinkwater.test' }),
    })
    const mails = await until(async () => {
      const all = await mailbox()
      return all.some(m => m.to.includes('newcomer@')) && all.some(m => m.to.includes('analyst@')) && all
    }, 10_000, 'the invitation and the reset mail')
    for (const m of mails.filter(m => /newcomer@|analyst@/.test(m.to))) {
      expect(m.text).toContain('/password/[link withheld: it went to the recipient only]')
      expect(`${m.text}${m.html ?? ''}`).not.toMatch(TOKEN_LINK)
    }
  })
})

describe('backups', () => {
  it('hold no pending invitation or reset, and no account link in stored mail', async () => {
    // A server whose mailbox keeps links (as in the demo) and has a pending invitation.
    const demo = await new TestServer({ stderr: 'ignore' }).init()
    await demo.start()
    try {
      const a = await Http.signIn(demo.base, 'admin@brinkwater.test')
      expect((await a.post('/api/admin/invitations', { email: 'pending@example.test', name: 'Pending Person' })).status).toBe(201)
      const invite = await until(async () => ((await a.get('/api/dev/mailbox')).json as Mail[]).find(m => m.to.includes('pending@')), 10_000, 'invite')
      const token = TOKEN_LINK.exec(invite.text)![0].slice('/password/'.length)
      const res = await fetch(`${demo.base}/api/admin/backup`, { headers: { cookie: a.cookie } })
      expect(res.status).toBe(200)
      const file = join(dir, 'backup.sqlite')
      writeFileSync(file, Buffer.from(await res.arrayBuffer()))
      const copy = new Database(file, { readonly: true })
      try {
        expect((copy.prepare('SELECT count(*) AS n FROM account_tokens').get() as { n: number }).n).toBe(0)
        const stored = copy.prepare('SELECT text, html FROM caught_mail').all() as Array<{ text: string; html: string | null }>
        expect(stored.length).toBeGreaterThan(0)
        for (const m of stored) expect(`${m.text}${m.html ?? ''}`).not.toMatch(TOKEN_LINK)
      }
      finally { copy.close() }
      // Not even in the file's free pages.
      expect(readFileSync(file).includes(token)).toBe(false)
      // The live server's link still works: only the copy lost it.
      expect((await new Http(demo.base).post('/api/auth/password', { token, password: 'a long enough password' })).status).toBe(200)
    }
    finally { await demo.dispose() }
  }, 90_000)
})
