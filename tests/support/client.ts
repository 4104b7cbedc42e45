// A small HTTP client with a cookie jar, for talking to the test server as one person.
import { inject } from 'vitest'

export const DEMO_PASSWORD = 'brinkwater-demo'
export const DEMO = {
  admin: 'admin@brinkwater.test',
  facilitator: 'facilitator@brinkwater.test',
  science: 'science@brinkwater.test',
  civil: 'civil@brinkwater.test',
  comms: 'comms@brinkwater.test',
  evaluator: 'evaluator@brinkwater.test',
  analyst: 'analyst@brinkwater.test',
} as const
export type DemoKey = keyof typeof DEMO

export const baseUrl = () => inject('baseUrl')

export class Client {
  cookies = new Map<string, string>()

  get cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  }

  async request(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    const init: RequestInit = { method, headers: { ...headers }, redirect: 'manual' }
    if (this.cookies.size) (init.headers as Record<string, string>).cookie = this.cookieHeader
    if (body !== undefined) {
      if (typeof body === 'string' || body instanceof FormData) init.body = body
      else {
        init.body = JSON.stringify(body);
        (init.headers as Record<string, string>)['content-type'] = 'application/json'
      }
    }
    const res = await fetch(`${baseUrl()}${path}`, init)
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';')
      const i = pair!.indexOf('=')
      const name = pair!.slice(0, i)
      const value = pair!.slice(i + 1)
      if (!value || /max-age=0/i.test(c)) this.cookies.delete(name)
      else this.cookies.set(name, value)
    }
    const text = await res.text()
    let json: any = null // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
    try { json = text ? JSON.parse(text) : null }
    catch { json = null }
    return { status: res.status, headers: res.headers, json, text }
  }

  get(path: string) { return this.request('GET', path) }
  post(path: string, body?: unknown) { return this.request('POST', path, body ?? {}) }
  put(path: string, body?: unknown) { return this.request('PUT', path, body ?? {}) }
  patch(path: string, body?: unknown) { return this.request('PATCH', path, body ?? {}) }
  delete(path: string) { return this.request('DELETE', path) }

  async login(email: string, password = DEMO_PASSWORD) {
    const res = await this.post('/api/auth/login', { email, password })
    if (res.status !== 200) throw new Error(`login ${email} → ${res.status} ${res.text}`)
    return this
  }
}

const cache = new Map<string, Client>()
/** A signed-in client for a demo account (reused across tests in one file). */
export async function as(who: DemoKey): Promise<Client> {
  if (!cache.has(who)) cache.set(who, await new Client().login(DEMO[who]))
  return cache.get(who)!
}

/** Caught mail to one address, newest first (read through the admin's development mailbox). */
export async function mailTo(address: string) {
  const admin = await as('admin')
  const res = await admin.get('/api/dev/mailbox')
  if (res.status !== 200) throw new Error(`mailbox → ${res.status}`)
  return (res.json as Array<{ to: string; subject: string; text: string }>).filter(m => m.to.includes(address))
}

/** Invites a new member by e-mail and follows the link to set a password; returns a signed-in client. */
export async function newMember(name = 'Test Person') {
  const email = `p-${Math.random().toString(36).slice(2, 10)}@example.test`
  const admin = await as('admin')
  const inv = await admin.post('/api/admin/invitations', { email, name })
  if (inv.status !== 201) throw new Error(`invite → ${inv.status} ${inv.text}`)
  const [mail] = await mailTo(email)
  const token = /\/password\/([\w-]+)/.exec(mail!.text)![1]!
  const c = new Client()
  const set = await c.post('/api/auth/password', { token, password: 'a-long-test-password' })
  if (set.status !== 200) throw new Error(`set password → ${set.status} ${set.text}`)
  return { client: c, email, id: set.json.user.id as string }
}
