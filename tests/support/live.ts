// Helpers for the live exercise tests: a fresh exercise from the demo scenario with its own people
// (so that the demo accounts' exercise lists stay as other tests expect), and socket clients.
import { io, type Socket } from 'socket.io-client'
import { as, baseUrl, Client, mailTo } from './client'
import type { Scenario } from '../../shared/scenario/schema'

/** Invites a person (optionally an admin, who may start exercises) and signs them in. */
export async function newPerson(name: string, systemRole: 'admin' | 'member' = 'member') {
  const email = `live-${Math.random().toString(36).slice(2, 10)}@example.test`
  const admin = await as('admin')
  const inv = await admin.post('/api/admin/invitations', { email, name, systemRole })
  if (inv.status !== 201) throw new Error(`invite → ${inv.status} ${inv.text}`)
  const [mail] = await mailTo(email)
  const token = /\/password\/([\w-]+)/.exec(mail!.text)![1]!
  const client = new Client()
  const set = await client.post('/api/auth/password', { token, password: 'a-long-test-password' })
  if (set.status !== 200) throw new Error(`set password → ${set.status} ${set.text}`)
  return { client, email, id: set.json.user.id as string }
}

export type Person = Awaited<ReturnType<typeof newPerson>>

export interface LiveCast {
  id: string
  facilitator: Person
  science: Person
  civil: Person
  comms: Person
  evaluator: Person
  analyst: Person
}

/** A new exercise from the demo scenario, facilitated by a new admin, with one player per team, an evaluator and an analyst. */
export async function newLiveExercise(title = 'Live test drill'): Promise<LiveCast> {
  const facilitator = await newPerson('Facilitator', 'admin')
  const scenarios = await facilitator.client.get('/api/scenarios')
  const demo = (scenarios.json as Array<{ id: string; key: string }>).find(s => s.key === 'demo-ocean-impact')!
  const created = await facilitator.client.post(`/api/scenarios/${demo.id}/exercises`, { title })
  if (created.status !== 201) throw new Error(`start exercise → ${created.status} ${created.text}`)
  const id = created.json.id as string
  const cast = { id, facilitator } as LiveCast
  const roles: Array<[keyof LiveCast, string, string | null]> = [
    ['science', 'player', 'science'], ['civil', 'player', 'civil'], ['comms', 'player', 'comms'],
    ['evaluator', 'evaluator', null], ['analyst', 'analyst', null],
  ]
  for (const [slot, role, teamKey] of roles) {
    const p = await newPerson(`${String(slot)} member`)
    const add = await facilitator.client.post(`/api/exercises/${id}/members`, { email: p.email, role, teamKey })
    if (add.status !== 201) throw new Error(`add member → ${add.status} ${add.text}`)
    Object.assign(cast, { [slot]: p })
  }
  return cast
}

/** The demo ocean-impact scenario's document, as a member of the library reads it. */
export async function demoScenario(who: Person): Promise<Scenario> {
  const list = (await who.client.get('/api/scenarios')).json as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  return (await who.client.get(`/api/scenarios/${demo.id}`)).json.document as Scenario
}

export interface LiveMessage {
  seq: number
  type: string
  wallTime: string
  scenarioTime: string
  data: any // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any payload
}

/** A socket that records every `event` and `live:ready` it receives. */
export interface LiveSocket {
  socket: Socket
  events: LiveMessage[]
  ready: any[] // eslint-disable-line @typescript-eslint/no-explicit-any -- see above
  errors: Error[]
}

const open: Socket[] = []

/** Connects a live socket (websocket) with a session cookie (or none) and handshake auth. */
export function liveSocket(cookie: string | null, auth: Record<string, unknown>, url = baseUrl()): LiveSocket {
  const socket = io(
    url,
    {
      path: '/socket.io/',
      transports: ['websocket'],
      reconnection: false,
      forceNew: true,
      extraHeaders: cookie ? { cookie } : {},
      auth,
      timeout: 5000,
    },
  )
  const s: LiveSocket = { socket, events: [], ready: [], errors: [] }
  socket.on('event', (e: LiveMessage) => s.events.push(e))
  socket.on('live:ready', (r: unknown) => s.ready.push(r))
  socket.on('connect_error', (err: Error) => s.errors.push(err))
  open.push(socket)
  return s
}

/** Closes every socket opened by liveSocket. */
export function closeSockets() {
  while (open.length) open.pop()!.close()
}

/** Waits until `check` returns (or resolves to) a truthy value, polling every 20 ms; fails after `ms`. */
export async function until<T>(
  check: () => T | undefined | null | false | Promise<T | undefined | null | false>,
  ms = 10_000,
  what = 'condition',
): Promise<T> {
  const deadline = Date.now() + ms
  for (;;) {
    const v = await check()
    if (v) return v
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await new Promise(r => setTimeout(r, 20))
  }
}

/** Waits for a socket's live:ready (after its replay). */
export function ready(s: LiveSocket) {
  return until(() => {
    if (s.errors[0]) throw s.errors[0]
    return s.ready[0]
  }, 10_000, 'live:ready')
}

/** Waits for a socket's connect_error and returns its message. */
export async function refused(s: LiveSocket): Promise<string> {
  const err = await until(() => {
    if (s.socket.connected) throw new Error('connected, expected a refusal')
    return s.errors[0]
  }, 10_000, 'connect_error')
  return err.message
}

/** A fresh idempotency key. */
export const ikey = () => `k-${crypto.randomUUID()}`
