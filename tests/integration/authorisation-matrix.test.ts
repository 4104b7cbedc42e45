// The authorisation matrix: every API route and every socket room against every role, generated
// from ONE table (MATRIX below), plus a check that walks server/api and fails when a route file has
// no row, so that a new route cannot be missed. Allowed callers get a request that passes the guard
// and stops harmlessly after it (an invalid body → 400, an already released inject → 409, …), so
// the answer tells the guard's decision apart from everything else.
import { readdirSync } from 'node:fs'
import { join, relative, resolve } from 'node:path'
import { io } from 'socket.io-client'
import { beforeAll, afterAll, describe, expect, it } from 'vitest'
import { as, baseUrl, Client, DEMO } from '../support/client'
import { ikey, newPerson, until } from '../support/live'
import type { Scenario } from '../../shared/scenario'
import { HOTWASH_KEYS } from '../../shared/review/plan'

const ROLES = ['anonymous', 'admin', 'facilitator', 'science', 'civil', 'comms', 'evaluator', 'analyst', 'outsider', 'wall'] as const
type Role = typeof ROLES[number]
type Member = 'facilitator' | 'science' | 'civil' | 'comms' | 'evaluator' | 'analyst'
const MEMBERS: Member[] = ['facilitator', 'science', 'civil', 'comms', 'evaluator', 'analyst']
const PLAYERS: Member[] = ['science', 'civil', 'comms']

/** An expected answer: a status, optionally with a message that tells two same-status answers apart. */
type Expect = number | { status: number; message: RegExp }
type Expectations = Record<Role, Expect>

interface Ctx {
  exerciseId: string
  scenarioId: string
  released: string
  published: string
  facilitatorId: string
  exerciseAttachment: string
  scenarioAttachment: string
  wallToken: string
  missing: string
}
interface Call { path: string; body?: unknown }

const NO_EXERCISE = { status: 404, message: /No such exercise/ }
const everyone = (ok: Expect): Expectations => Object.fromEntries(ROLES.map(r => [r, ok])) as Expectations
const signedIn = (ok: Expect): Expectations => ({ ...everyone(ok), anonymous: 401, wall: 401 })
const adminOnly = (ok: Expect): Expectations => ({ ...signedIn(403), admin: ok })
/** The scenario library: admins and authors (the demo facilitator may author). */
const authors = (ok: Expect): Expectations => ({ ...signedIn(403), admin: ok, facilitator: ok })
/** An exercise route: the given members pass, other members 403, outsiders (and admins unless `admin`) 404. */
function inExercise(allowed: readonly Member[], ok: Expect, opts: { admin?: boolean } = {}): Expectations {
  const e = { ...signedIn(403), outsider: NO_EXERCISE, admin: opts.admin ? ok : NO_EXERCISE } as Expectations
  for (const m of MEMBERS) e[m] = allowed.includes(m) ? ok : 403
  return e
}

interface RouteRow { route: string; call: (c: Ctx) => Call; expect: Expectations }
interface RoomRow { room: string; expect: Partial<Record<Role, boolean>> }

const X = (c: Ctx) => `/api/exercises/${c.exerciseId}`
const S = (c: Ctx) => `/api/scenarios/${c.scenarioId}`
const INVALID: unknown = [] // every JSON body schema is an object: an array is refused after the guard

/**
 * THE table. Routes are keyed "METHOD file path under server/api"; rooms by the room name (which
 * roles' sockets hear the room's traffic; a role missing from a room row hears nothing of it).
 */
const MATRIX: { routes: RouteRow[]; rooms: RoomRow[] } = {
  routes: [
    { route: 'GET admin/audit.get.ts', call: () => ({ path: '/api/admin/audit?limit=5' }), expect: adminOnly(200) },
    { route: 'GET admin/backup.get.ts', call: () => ({ path: '/api/admin/backup' }), expect: adminOnly(200) },
    { route: 'POST admin/invitations.post.ts', call: () => ({ path: '/api/admin/invitations', body: INVALID }), expect: adminOnly(400) },
    { route: 'GET admin/users/index.get.ts', call: () => ({ path: '/api/admin/users' }), expect: adminOnly(200) },
    { route: 'POST auth/forgot.post.ts', call: () => ({ path: '/api/auth/forgot', body: INVALID }), expect: everyone(400) },
    { route: 'POST auth/login.post.ts', call: () => ({ path: '/api/auth/login', body: INVALID }), expect: everyone(400) },
    { route: 'POST auth/logout.post.ts', call: () => ({ path: '/api/auth/logout' }), expect: everyone(200) },
    { route: 'POST auth/password.post.ts', call: () => ({ path: '/api/auth/password', body: INVALID }), expect: everyone(400) },
    { route: 'GET dev/mailbox.get.ts', call: () => ({ path: '/api/dev/mailbox' }), expect: adminOnly(200) },
    { route: 'GET health.get.ts', call: () => ({ path: '/api/health' }), expect: everyone(200) },
    { route: 'GET me.get.ts', call: () => ({ path: '/api/me' }), expect: signedIn(200) },
    { route: 'GET exercises/index.get.ts', call: () => ({ path: '/api/exercises' }), expect: signedIn(200) },
    { route: 'GET exercises/[id].get.ts', call: c => ({ path: X(c) }), expect: inExercise(MEMBERS, 200, { admin: true }) },
    {
      route: 'GET exercises/[id]/attachments/[attachmentId].get.ts',
      call: c => ({ path: `${X(c)}/attachments/${c.exerciseAttachment}` }),
      expect: inExercise(MEMBERS, 200, { admin: true }),
    },
    {
      route: 'POST exercises/[id]/clock.post.ts',
      call: c => ({ path: `${X(c)}/clock`, body: INVALID }),
      expect: inExercise(['facilitator'], 400),
    },
    {
      route: 'GET exercises/[id]/events.get.ts',
      call: c => ({ path: `${X(c)}/events` }),
      expect: inExercise(MEMBERS, 200, { admin: true }),
    },
    { route: 'GET exercises/[id]/live.get.ts', call: c => ({ path: `${X(c)}/live` }), expect: inExercise(MEMBERS, 200, { admin: true }) },
    {
      route: 'POST exercises/[id]/injects/[key]/hold.post.ts',
      call: c => ({ path: `${X(c)}/injects/${c.released}/hold` }),
      expect: inExercise(['facilitator'], 409),
    },
    {
      route: 'POST exercises/[id]/injects/[key]/release.post.ts',
      call: c => ({ path: `${X(c)}/injects/${c.released}/release` }),
      expect: inExercise(['facilitator'], 409),
    },
    {
      route: 'POST exercises/[id]/solutions/[key]/publish.post.ts',
      call: c => ({ path: `${X(c)}/solutions/${c.published}/publish` }),
      expect: inExercise(['facilitator'], 409),
    },
    {
      route: 'POST exercises/[id]/members/index.post.ts',
      call: c => ({ path: `${X(c)}/members`, body: INVALID }),
      expect: inExercise(['facilitator'], 400),
    },
    {
      route: 'PATCH exercises/[id]/members/[userId].patch.ts',
      call: c => ({ path: `${X(c)}/members/${c.facilitatorId}`, body: INVALID }),
      expect: inExercise(['facilitator'], 400),
    },
    // The only facilitator cannot leave: 409 after the guard.
    {
      route: 'DELETE exercises/[id]/members/[userId].delete.ts',
      call: c => ({ path: `${X(c)}/members/${c.facilitatorId}` }),
      expect: inExercise(['facilitator'], 409),
    },
    {
      route: 'POST exercises/[id]/messages.post.ts',
      call: c => ({ path: `${X(c)}/messages`, body: INVALID }),
      // The facilitator to teams, a player from their team to control.
      expect: inExercise(['facilitator', 'science', 'civil', 'comms'], 400),
    },
    {
      route: 'POST exercises/[id]/zones/index.post.ts',
      call: c => ({ path: `${X(c)}/zones`, body: INVALID }),
      // A player for their team, the facilitator for the agencies control plays.
      expect: inExercise(['facilitator', 'science', 'civil', 'comms'], 400),
    },
    {
      route: 'DELETE exercises/[id]/zones/[zoneId].delete.ts',
      call: c => ({ path: `${X(c)}/zones/${c.missing}` }),
      expect: inExercise(['facilitator', 'science', 'civil', 'comms'], { status: 404, message: /No such zone/ }),
    },
    {
      route: 'POST exercises/[id]/observations.post.ts',
      call: c => ({ path: `${X(c)}/observations`, body: INVALID }),
      expect: inExercise(['evaluator', 'facilitator'], 400),
    },
    {
      route: 'POST exercises/[id]/responses.post.ts',
      call: c => ({ path: `${X(c)}/responses`, body: INVALID }),
      expect: inExercise(PLAYERS, 400),
    },
    {
      route: 'POST exercises/[id]/scores.post.ts',
      call: c => ({ path: `${X(c)}/scores`, body: INVALID }),
      expect: inExercise(['evaluator', 'facilitator'], 400),
    },
    {
      route: 'GET exercises/[id]/timeline.csv.get.ts',
      call: c => ({ path: `${X(c)}/timeline.csv` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/timeline.json.get.ts',
      call: c => ({ path: `${X(c)}/timeline.json` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/timeline.xlsx.get.ts',
      call: c => ({ path: `${X(c)}/timeline.xlsx` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/wall-tokens/index.get.ts',
      call: c => ({ path: `${X(c)}/wall-tokens` }),
      expect: inExercise(['facilitator'], 200),
    },
    {
      route: 'POST exercises/[id]/wall-tokens/index.post.ts',
      call: c => ({ path: `${X(c)}/wall-tokens`, body: INVALID }),
      expect: inExercise(['facilitator'], 400),
    },
    {
      route: 'DELETE exercises/[id]/wall-tokens/[tokenId].delete.ts',
      call: c => ({ path: `${X(c)}/wall-tokens/${c.missing}` }),
      expect: inExercise(['facilitator'], { status: 404, message: /wall link/ }),
    },
    // After-action routes (review desk, reports, feedback).
    {
      route: 'GET exercises/[id]/review/index.get.ts',
      call: c => ({ path: `${X(c)}/review` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/review/decisions.get.ts',
      call: c => ({ path: `${X(c)}/review/decisions` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/review/replay.get.ts',
      call: c => ({ path: `${X(c)}/review/replay` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/review/scoring.get.ts',
      call: c => ({ path: `${X(c)}/review/scoring` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/review/solutions/[key].get.ts',
      call: c => ({ path: `${X(c)}/review/solutions/${c.published}` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/findings/index.get.ts',
      call: c => ({ path: `${X(c)}/findings` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'POST exercises/[id]/findings/index.post.ts',
      call: c => ({ path: `${X(c)}/findings`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'PATCH exercises/[id]/findings/[findingId].patch.ts',
      call: c => ({ path: `${X(c)}/findings/${c.missing}`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'DELETE exercises/[id]/findings/[findingId].delete.ts',
      call: c => ({ path: `${X(c)}/findings/${c.missing}` }),
      expect: inExercise(['facilitator', 'analyst'], { status: 404, message: /finding/i }),
    },
    {
      route: 'GET exercises/[id]/improvements/index.get.ts',
      call: c => ({ path: `${X(c)}/improvements` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'POST exercises/[id]/improvements/index.post.ts',
      call: c => ({ path: `${X(c)}/improvements`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'PATCH exercises/[id]/improvements/[itemId].patch.ts',
      call: c => ({ path: `${X(c)}/improvements/${c.missing}`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'DELETE exercises/[id]/improvements/[itemId].delete.ts',
      call: c => ({ path: `${X(c)}/improvements/${c.missing}` }),
      expect: inExercise(['facilitator', 'analyst'], { status: 404, message: /item|improvement|action/i }),
    },
    {
      route: 'GET exercises/[id]/hotwash/index.get.ts',
      call: c => ({ path: `${X(c)}/hotwash` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'PUT exercises/[id]/hotwash/[section].put.ts',
      call: c => ({ path: `${X(c)}/hotwash/${HOTWASH_SECTION}`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'GET exercises/[id]/feedback/index.get.ts',
      call: c => ({ path: `${X(c)}/feedback` }),
      expect: inExercise(['facilitator', 'analyst', 'evaluator'], 200, { admin: true }),
    },
    {
      route: 'POST exercises/[id]/feedback/index.post.ts',
      call: c => ({ path: `${X(c)}/feedback`, body: INVALID }),
      expect: inExercise(MEMBERS, 400),
    },
    { route: 'GET exercises/[id]/feedback/mine.get.ts', call: c => ({ path: `${X(c)}/feedback/mine` }), expect: inExercise(MEMBERS, 200) },
    {
      route: 'POST exercises/[id]/feedback/request.post.ts',
      call: c => ({ path: `${X(c)}/feedback/request`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'GET exercises/[id]/report/index.get.ts',
      call: c => ({ path: `${X(c)}/report` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    {
      route: 'POST exercises/[id]/report/send.post.ts',
      call: c => ({ path: `${X(c)}/report/send`, body: INVALID }),
      expect: inExercise(['facilitator', 'analyst'], 400),
    },
    {
      route: 'GET exercises/[id]/report.pdf.get.ts',
      call: c => ({ path: `${X(c)}/report.pdf` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    {
      route: 'GET exercises/[id]/inject-cards.pdf.get.ts',
      call: c => ({ path: `${X(c)}/inject-cards.pdf` }),
      expect: inExercise(['facilitator', 'analyst'], 200, { admin: true }),
    },
    // The scenario library.
    { route: 'GET scenarios/index.get.ts', call: () => ({ path: '/api/scenarios' }), expect: authors(200) },
    { route: 'POST scenarios/index.post.ts', call: () => ({ path: '/api/scenarios', body: INVALID }), expect: authors(400) },
    { route: 'POST scenarios/import.post.ts', call: () => ({ path: '/api/scenarios/import', body: INVALID }), expect: authors(400) },
    { route: 'POST scenarios/preview.post.ts', call: () => ({ path: '/api/scenarios/preview', body: INVALID }), expect: authors(400) },
    { route: 'GET scenarios/[id].get.ts', call: c => ({ path: S(c) }), expect: authors(200) },
    { route: 'PUT scenarios/[id].put.ts', call: c => ({ path: S(c), body: INVALID }), expect: authors(400) },
    { route: 'DELETE scenarios/[id].delete.ts', call: c => ({ path: `/api/scenarios/${c.missing}` }), expect: authors({ status: 404, message: /No such scenario/ }) },
    { route: 'GET scenarios/[id]/export.get.ts', call: c => ({ path: `${S(c)}/export` }), expect: authors(200) },
    { route: 'GET scenarios/[id]/msel.xlsx.get.ts', call: c => ({ path: `${S(c)}/msel.xlsx` }), expect: authors(200) },
    { route: 'GET scenarios/[id]/msel.csv.get.ts', call: c => ({ path: `${S(c)}/msel.csv` }), expect: authors(200) },
    { route: 'POST scenarios/[id]/msel.post.ts', call: c => ({ path: `${S(c)}/msel`, body: INVALID }), expect: authors(400) },
    { route: 'POST scenarios/[id]/duplicate.post.ts', call: c => ({ path: `/api/scenarios/${c.missing}/duplicate` }), expect: authors({ status: 404, message: /No such scenario/ }) },
    { route: 'POST scenarios/[id]/exercises.post.ts', call: c => ({ path: `${S(c)}/exercises`, body: INVALID }), expect: authors(400) },
    {
      route: 'GET scenarios/[id]/attachments/[attachmentId].get.ts',
      call: c => ({ path: `${S(c)}/attachments/${c.scenarioAttachment}` }),
      expect: authors(200),
    },
    {
      route: 'POST scenarios/[id]/attachments/index.post.ts',
      call: c => ({ path: `${S(c)}/attachments`, body: INVALID }),
      expect: authors(400),
    },
    // The wall view: the share token is the only key; everyone holding it reads the wall.
    { route: 'GET wall/[token].get.ts', call: c => ({ path: `/api/wall/${c.wallToken}` }), expect: everyone(200) },
  ],
  rooms: [
    { room: 'team:science', expect: { facilitator: true, science: true, evaluator: true, analyst: true, admin: true } },
    { room: 'team:civil', expect: { facilitator: true, civil: true, evaluator: true, analyst: true, admin: true } },
    { room: 'team:comms', expect: { facilitator: true, comms: true, evaluator: true, analyst: true, admin: true } },
    { room: 'control', expect: { facilitator: true } },
    { room: 'evaluators', expect: { facilitator: true, evaluator: true, analyst: true, admin: true } },
    {
      room: 'wall',
      expect: { facilitator: true, science: true, civil: true, comms: true, evaluator: true, analyst: true, admin: true, wall: true },
    },
  ],
}
const HOTWASH_SECTION = HOTWASH_KEYS[0]

/** Every route file under server/api as "METHOD relative/path". */
function routeFiles(): string[] {
  const root = resolve(import.meta.dirname, '../../server/api')
  return (readdirSync(root, { recursive: true, withFileTypes: true }) as Array<{ name: string; parentPath: string; isFile: () => boolean }>)
    .filter(d => d.isFile() && d.name.endsWith('.ts'))
    .map((d) => {
      const file = relative(root, join(d.parentPath, d.name)).split('\\').join('/')
      const method = /\.(get|post|put|patch|delete)\.ts$/.exec(file)?.[1]?.toUpperCase() ?? 'ANY'
      return `${method} ${file}`
    }).sort()
}

const clients = {} as Record<Role, Client>
/** A second session of each signed-in role, for the sign-out row: a sign-out now ends the session for good. */
const spare = {} as Partial<Record<Role, Client>>
const ctx = {} as Ctx

beforeAll(async () => {
  const facilitator = await as('facilitator')
  const demo = (await facilitator.get('/api/scenarios')).json.find((s: { key: string }) => s.key === 'demo-ocean-impact')
  ctx.scenarioId = demo.id
  const scenario = (await facilitator.get(`/api/scenarios/${demo.id}`)).json
  ctx.scenarioAttachment = scenario.attachments[0].id
  ctx.exerciseId = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Authorisation matrix' })).json.id
  const other = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Another drill' })).json.id
  ctx.facilitatorId = (await facilitator.get('/api/me')).json.user.id
  ctx.missing = crypto.randomUUID()
  clients.facilitator = facilitator
  clients.admin = await as('admin')
  spare.facilitator = await new Client().login(DEMO.facilitator)
  spare.admin = await new Client().login(DEMO.admin)
  clients.anonymous = new Client()
  clients.wall = new Client()
  for (const [slot, role, teamKey] of [
    ['science', 'player', 'science'],
    ['civil', 'player', 'civil'],
    ['comms', 'player', 'comms'],
    ['evaluator', 'evaluator', null],
    ['analyst', 'analyst', null],
  ] as const) {
    const p = await newPerson(`Matrix ${slot}`)
    expect((await facilitator.post(`/api/exercises/${ctx.exerciseId}/members`, { email: p.email, role, teamKey })).status).toBe(201)
    clients[slot] = p.client
    spare[slot] = await new Client().login(p.email, 'a-long-test-password')
  }
  const outsider = await newPerson('Matrix outsider')
  expect((await facilitator.post(
    `/api/exercises/${other}/members`,
    { email: outsider.email, role: 'player', teamKey: 'science' },
  )).status).toBe(201)
  clients.outsider = outsider.client
  spare.outsider = await new Client().login(outsider.email, 'a-long-test-password')

  const doc = scenario.document as Scenario
  ctx.released = doc.injects.find(i => !i.contingency)!.key
  ctx.published = doc.solutions[0]!.key
  expect((await facilitator.post(`/api/exercises/${ctx.exerciseId}/clock`, { action: 'start', factor: 1 })).status).toBe(200)
  expect((await facilitator.post(`/api/exercises/${ctx.exerciseId}/injects/${ctx.released}/release`)).status).toBe(201)
  expect((await facilitator.post(`/api/exercises/${ctx.exerciseId}/solutions/${ctx.published}/publish`)).status).toBe(201)
  const details = (await facilitator.get(`/api/exercises/${ctx.exerciseId}`)).json
  ctx.exerciseAttachment = details.attachments[0].id
  ctx.wallToken = (await facilitator.post(`/api/exercises/${ctx.exerciseId}/wall-tokens`, { label: 'Matrix wall' })).json.token
}, 120_000)

describe('the authorisation matrix', () => {
  it('has a row for every route file under server/api, and no row without a file', () => {
    const files = routeFiles()
    const rows = MATRIX.routes.map(r => r.route)
    expect(new Set(rows).size, 'a route listed twice').toBe(rows.length)
    expect(files.filter(f => !rows.includes(f)), 'route files missing from MATRIX.routes: add a row for each').toEqual([])
    expect(rows.filter(r => !files.includes(r)), 'rows of MATRIX.routes without a file').toEqual([])
  })

  it('every route answers every role as the table says', async () => {
    const failures: string[] = []
    let cells = 0
    for (const row of MATRIX.routes) {
      const method = row.route.split(' ')[0]!
      const { path, body } = row.call(ctx)
      await Promise.all(ROLES.map(async (role) => {
        // Calls never keep cookies here, and the sign-out row uses each role's spare session: it must not end the one
        // the other rows use.
        const c = (row.route === 'POST auth/logout.post.ts' ? spare[role] : undefined) ?? clients[role]
        const res = await new Client().request(method, path, body, c.cookies.size ? { cookie: c.cookieHeader } : {})
        cells++
        const want = row.expect[role]
        const status = typeof want === 'number' ? want : want.status
        const message = typeof want === 'number' ? null : want.message
        const ok = res.status === status && (!message || message.test(res.json?.message ?? ''))
        if (!ok) failures.push(`${row.route} as ${role}: expected ${status}${message ? ` ${message}` : ''}, got ${res.status} ${(res.json?.message ?? '').slice(0, 80)}`)
      }))
    }
    console.info(`[authorisation-matrix] ${MATRIX.routes.length} routes × ${ROLES.length} roles = ${cells} HTTP cells`)
    expect(failures).toEqual([])
  }, 120_000)
})

describe('socket rooms against every role', () => {
  const sockets: ReturnType<typeof io>[] = []
  afterAll(() => { for (const s of sockets) s.close() })

  it('each role joins only the rooms the table gives it; outsiders and anonymous callers are refused', async () => {
    type Heard = Array<{ type: string; data: any }> // eslint-disable-line @typescript-eslint/no-explicit-any -- payloads of every type
    const heard = Object.fromEntries(ROLES.map(r => [r, [] as Heard])) as Record<Role, Heard>
    const results = {} as Record<Role, string>
    await Promise.all(ROLES.map(role => new Promise<void>((done) => {
      const auth = role === 'wall' ? { wallToken: ctx.wallToken } : { exerciseId: ctx.exerciseId }
      const cookie: Record<string, string> = clients[role].cookies.size ? { cookie: clients[role].cookieHeader } : {}
      const s = io(
        baseUrl(),
        { path: '/socket.io/', transports: ['websocket'], forceNew: true, reconnection: false, extraHeaders: cookie, auth },
      )
      sockets.push(s)
      s.on('event', (e: { type: string; data: unknown }) => heard[role].push(e as never))
      s.once('live:ready', (r: { view: string }) => { results[role] = `ready:${r.view}`; done() })
      s.once('connect_error', (err: Error) => { results[role] = `refused:${err.message}`; done() })
    })))
    expect(results).toEqual({
      anonymous: 'refused:unauthorized', outsider: 'refused:forbidden', wall: 'ready:wall',
      admin: 'ready:evaluator', facilitator: 'ready:control', science: 'ready:player', civil: 'ready:player', comms: 'ready:player',
      evaluator: 'ready:evaluator', analyst: 'ready:evaluator',
    })
    for (const role of ROLES) heard[role].length = 0

    // One probe per room: something only that room's audience may hear.
    const f = clients.facilitator
    const x = `/api/exercises/${ctx.exerciseId}`
    const doc = (await f.get(`/api/scenarios/${ctx.scenarioId}`)).json.document as Scenario
    type Probe = (e: { type: string; data: any }) => boolean // eslint-disable-line @typescript-eslint/no-explicit-any -- see above
    const probes = new Map<string, Probe>()
    for (const team of ['science', 'civil', 'comms']) {
      const inject = doc.injects.find(i => !i.contingency && i.teams.length === 1 && i.teams[0] === team && i.key !== ctx.released)!
      expect((await f.post(`${x}/injects/${inject.key}/release`)).status).toBe(201)
      probes.set(`team:${team}`, e => e.type === 'inject.released' && e.data.key === inject.key)
    }
    const hold = await f.post(`${x}/injects/${doc.injects.at(-1)!.key}/hold`)
    expect([200, 201]).toContain(hold.status)
    probes.set('control', e => e.type === 'inject.held')
    expect((await clients.evaluator.post(`${x}/observations`, { text: 'Matrix probe', idempotencyKey: ikey() })).status).toBe(201)
    probes.set('evaluators', e => e.type === 'observation.recorded' && e.data.text === 'Matrix probe')
    expect((await f.post(`${x}/clock`, { action: 'pause' })).status).toBe(200)
    probes.set('wall', e => e.type === 'clock.changed' && e.data.action === 'pause')

    await until(() => heard.wall.some(probes.get('wall')!) && heard.facilitator.some(probes.get('evaluators')!), 10_000, 'the probes')
    await new Promise(r => setTimeout(r, 300))
    const failures: string[] = []
    let cells = 0
    for (const row of MATRIX.rooms) {
      const probe = probes.get(row.room)!
      for (const role of ROLES) {
        cells++
        const got = heard[role].some(probe)
        const want = row.expect[role] ?? false
        if (got !== want) failures.push(`room ${row.room} as ${role}: expected ${want ? 'heard' : 'silent'}, got ${got ? 'heard' : 'silent'}`)
      }
    }
    console.info(`[authorisation-matrix] ${MATRIX.rooms.length} rooms × ${ROLES.length} roles = ${cells} socket cells`)
    expect(failures).toEqual([])
    // A revoked wall link stops at once and cannot connect again.
    const tokenId = (await f.get(`${x}/wall-tokens`)).json.find((t: { label: string }) => t.label === 'Matrix wall').id
    expect((await f.request('DELETE', `${x}/wall-tokens/${tokenId}`)).status).toBe(204)
    const again = io(
      baseUrl(),
      { path: '/socket.io/', transports: ['websocket'], forceNew: true, reconnection: false, auth: { wallToken: ctx.wallToken } },
    )
    sockets.push(again)
    expect(await new Promise(r => again.once('connect_error', (e: Error) => r(e.message)))).toBe('forbidden')
    expect((await new Client().get(`/api/wall/${ctx.wallToken}`)).status).toBe(404)
  }, 60_000)
})
