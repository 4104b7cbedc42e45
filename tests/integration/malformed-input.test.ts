// Bad input, property-based (fast-check): random and malformed bodies for every route that reads
// one, wrong content types, random route parameters and queries, oversized uploads, YAML alias
// bombs and broken scenario files, path traversal in attachment names. Each gets a clear 4xx (never
// a 5xx) and leaves the data as it was: a checksum of every table is the same before and after.
// Inputs that would be valid are filtered out with the same shared zod schemas the routes use.
// Also: markdown with script/event-handler HTML is delivered as the markdown text it is, and CSV
// and XLSX exports guard cells against formula injection. This file runs its own server.
import { createHash } from 'node:crypto'
import { readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import Database from 'better-sqlite3'
import ExcelJS from 'exceljs'
import fc from 'fast-check'
import Papa from 'papaparse'
import { stringify as yamlStringify } from 'yaml'
import type { z } from 'zod'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO } from '../support/client'
import { demoScenario, Http, TestServer, type Answer } from '../support/test-server'
import { forgotSchema, inviteSchema, loginSchema, setPasswordSchema } from '../../shared/schemas/auth'
import {
  clockActionSchema,
  messageSchema,
  observationSchema,
  responseSchema,
  scoreSchema,
  wallTokenSchema,
} from '../../shared/schemas/live'
import {
  feedbackRequestSchema,
  feedbackSchema,
  findingPatchSchema,
  findingSchema,
  hotwashSchema,
  improvementPatchSchema,
  improvementSchema,
  reportSendSchema,
} from '../../shared/schemas/review'
import {
  createScenarioSchema,
  memberPatchSchema,
  memberSchema,
  previewSchema,
  saveScenarioSchema,
  startExerciseSchema,
} from '../../shared/schemas/scenarios'
import { HOTWASH_KEYS } from '../../shared/review/plan'
import { parseScenarioYaml, stringifyScenario, validateScenario, type Scenario } from '../../shared/scenario'

const RUNS = Number(process.env.HARDENING_RUNS) || 40
const server = new TestServer({ stderr: 'capture' })
const tried: Record<string, number> = {}
const count = (what: string, n = 1) => { tried[what] = (tried[what] ?? 0) + n }

let admin: Http, facilitator: Http, science: Http, evaluator: Http, analyst: Http, anonymous: Http
let exerciseId = ''
let scenarioId = ''
const scenarioRevision = 1
let scienceId = ''
let demo: Scenario
const x = (p = '') => `/api/exercises/${exerciseId}${p}`

/** A checksum of every table (the scheduler's lease row is renewed on its own and left out). */
function checksum(exclude: string[] = []): string {
  const db = new Database(server.dbPath)
  try {
    const tables = (db.prepare(`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name`).all() as Array<{ name: string }>)
      .map(t => t.name).filter(t => !['scheduler_leases', ...exclude].includes(t))
    const h = createHash('sha256')
    for (const t of tables) {
      h.update(t)
      for (const row of db.prepare(`select * from "${t}" order by rowid`).raw().iterate()) h.update(JSON.stringify(
        row,
        (_k, v) => (typeof v === 'bigint' ? String(v) : Buffer.isBuffer(v) ? v.toString('hex') : v),
      ))
    }
    return h.digest('hex')
  }
  finally { db.close() }
}

/** A clear refusal: a 4xx with a message (the JSON error of the API). */
function expectClear4xx(res: Answer, what: string) {
  expect(res.status, `${what}: ${res.status} ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400)
  expect(res.status, `${what}: ${res.status} ${res.text.slice(0, 200)}`).toBeLessThan(500)
  expect(typeof res.json?.message, `${what}: no message`).toBe('string')
  expect(res.json.message.length).toBeGreaterThan(0)
}

/** Runs `body` and checks that no table changed. */
async function untouched(body: () => Promise<void>, exclude: string[] = []) {
  const before = checksum(exclude)
  await body()
  expect(checksum(exclude), 'the data changed').toBe(before)
}

const nest = (depth: number) => JSON.parse('['.repeat(depth) + ']'.repeat(depth)) as unknown
/** Bodies that break a valid example: anything JSON, one field replaced or dropped, huge strings, deep nesting. */
function brokenBodies(valid: Record<string, unknown>) {
  const keys = Object.keys(valid)
  return fc.oneof(
    fc.jsonValue(),
    fc.tuple(fc.constantFrom(...keys), fc.jsonValue()).map(([k, v]) => ({ ...valid, [k]: v })),
    fc.constantFrom(...keys).map(k => Object.fromEntries(Object.entries(valid).filter(([key]) => key !== k))),
    fc.tuple(fc.constantFrom(...keys), fc.integer({ min: 20_001, max: 60_000 })).map(([k, n]) => ({ ...valid, [k]: 'x'.repeat(n) })),
    fc.tuple(fc.constantFrom(...keys), fc.integer({ min: 10, max: 3000 })).map(([k, d]) => ({ ...valid, [k]: nest(d) })),
    fc.dictionary(fc.string(), fc.jsonValue()),
  )
}

interface BodyRoute {
  name: string
  method: string
  path: () => string
  as: () => Http
  schema: z.ZodType
  valid: () => Record<string, unknown>
  alsoValid?: (b: unknown) => boolean
}
const BODY_ROUTES: BodyRoute[] = [
  {
    name: 'invitation',
    method: 'POST',
    path: () => '/api/admin/invitations',
    as: () => admin,
    schema: inviteSchema,
    valid: () => ({ email: 'a@example.test', name: 'A', systemRole: 'member' }),
  },
  {
    name: 'login',
    method: 'POST',
    path: () => '/api/auth/login',
    as: () => anonymous,
    schema: loginSchema,
    valid: () => ({ email: 'a@example.test', password: 'p' }),
  },
  {
    name: 'forgot',
    method: 'POST',
    path: () => '/api/auth/forgot',
    as: () => anonymous,
    schema: forgotSchema,
    valid: () => ({ email: 'a@example.test' }),
  },
  {
    name: 'password',
    method: 'POST',
    path: () => '/api/auth/password',
    as: () => anonymous,
    schema: setPasswordSchema,
    valid: () => ({ token: 'x'.repeat(43), password: 'a-long-password' }),
  },
  {
    name: 'clock',
    method: 'POST',
    path: () => x('/clock'),
    as: () => facilitator,
    schema: clockActionSchema,
    valid: () => ({ action: 'speed', factor: 2 }),
  },
  {
    name: 'member add',
    method: 'POST',
    path: () => x('/members'),
    as: () => facilitator,
    schema: memberSchema,
    valid: () => ({ email: DEMO.comms, role: 'player', teamKey: 'comms' }),
  },
  {
    name: 'member change',
    method: 'PATCH',
    path: () => x(`/members/${scienceId}`),
    as: () => facilitator,
    schema: memberPatchSchema,
    valid: () => ({ role: 'player', teamKey: 'civil' }),
  },
  {
    name: 'message',
    method: 'POST',
    path: () => x('/messages'),
    as: () => facilitator,
    schema: messageSchema,
    valid: () => ({ teams: ['science'], title: 'T', body: 'B', kind: 'message', idempotencyKey: 'k-12345678' }),
  },
  {
    name: 'observation',
    method: 'POST',
    path: () => x('/observations'),
    as: () => evaluator,
    schema: observationSchema,
    valid: () => ({ text: 'T', idempotencyKey: 'k-12345678' }),
  },
  {
    name: 'response',
    method: 'POST',
    path: () => x('/responses'),
    as: () => science,
    schema: responseSchema,
    valid: () => ({ injectKey: 'detection-alert', text: 'T', idempotencyKey: 'k-12345678' }),
  },
  {
    name: 'score',
    method: 'POST',
    path: () => x('/scores'),
    as: () => evaluator,
    schema: scoreSchema,
    valid: () => ({ criterionKey: 'c', taskKey: 't', rating: 'P', note: '', idempotencyKey: 'k-12345678' }),
  },
  {
    name: 'wall link',
    method: 'POST',
    path: () => x('/wall-tokens'),
    as: () => facilitator,
    schema: wallTokenSchema,
    valid: () => ({ label: 'L' }),
  },
  {
    name: 'finding',
    method: 'POST',
    path: () => x('/findings'),
    as: () => analyst,
    schema: findingSchema,
    valid: () => ({ kind: 'strength', objectiveKey: 'o', capability: 'C', title: 'T', detail: '' }),
  },
  {
    name: 'finding change',
    method: 'PATCH',
    path: () => x(`/findings/${crypto.randomUUID()}`),
    as: () => analyst,
    schema: findingPatchSchema,
    valid: () => ({ title: 'T' }),
  },
  {
    name: 'improvement',
    method: 'POST',
    path: () => x('/improvements'),
    as: () => analyst,
    schema: improvementSchema,
    valid: () => ({
      objectiveKey: 'o',
      capability: 'C',
      action: 'A',
      element: 'Planning',
      owner: 'O',
      startDate: '2031-01-01',
      dueDate: '2031-02-01',
      status: 'open',
    }),
  },
  {
    name: 'improvement change',
    method: 'PATCH',
    path: () => x(`/improvements/${crypto.randomUUID()}`),
    as: () => analyst,
    schema: improvementPatchSchema,
    valid: () => ({ owner: 'O' }),
  },
  {
    name: 'hotwash',
    method: 'PUT',
    path: () => x(`/hotwash/${HOTWASH_KEYS[0]}`),
    as: () => analyst,
    schema: hotwashSchema,
    valid: () => ({ body: 'B', revision: 0 }),
  },
  {
    name: 'feedback',
    method: 'POST',
    path: () => x('/feedback'),
    as: () => science,
    schema: feedbackSchema,
    valid: () => ({ ratings: {}, wentWell: '', toImprove: '' }),
  },
  {
    name: 'feedback request',
    method: 'POST',
    path: () => x('/feedback/request'),
    as: () => analyst,
    schema: feedbackRequestSchema,
    valid: () => ({ userIds: [crypto.randomUUID()], message: '' }),
  },
  {
    name: 'report by mail',
    method: 'POST',
    path: () => x('/report/send'),
    as: () => analyst,
    schema: reportSendSchema,
    valid: () => ({ userIds: [crypto.randomUUID()], message: '' }),
  },
  {
    name: 'new scenario',
    method: 'POST',
    path: () => '/api/scenarios',
    as: () => facilitator,
    schema: createScenarioSchema,
    valid: () => ({ title: 'T', key: 'k' }),
  },
  {
    name: 'scenario save',
    method: 'PUT',
    path: () => `/api/scenarios/${scenarioId}`,
    as: () => facilitator,
    schema: saveScenarioSchema,
    valid: () => ({ revision: scenarioRevision, document: demo }),
    alsoValid: b => validateScenario((b as { document?: unknown }).document).ok
      && (b as { revision?: unknown }).revision === scenarioRevision,
  },
  {
    name: 'start exercise',
    method: 'POST',
    path: () => `/api/scenarios/${scenarioId}/exercises`,
    as: () => facilitator,
    schema: startExerciseSchema,
    valid: () => ({ title: 'T', description: '' }),
  },
  {
    name: 'preview',
    method: 'POST',
    path: () => '/api/scenarios/preview',
    as: () => facilitator,
    schema: previewSchema,
    valid: () => ({ solution: demo.solutions[0]!.solution, sites: [], samples: 500, seed: 1 }),
  },
]

/** Every route with parameters, with the caller that may use it: random parameters must never reach a 5xx. */
const PARAM_ROUTES: Array<{ method: string; path: (p: string) => string; as: () => Http }> = [
  { method: 'GET', path: p => `/api/exercises/${p}`, as: () => facilitator },
  { method: 'GET', path: p => `/api/exercises/${p}/live`, as: () => facilitator },
  { method: 'GET', path: p => `/api/exercises/${p}/events`, as: () => facilitator },
  { method: 'GET', path: p => `/api/exercises/${p}/timeline.csv`, as: () => facilitator },
  { method: 'GET', path: p => x(`/attachments/${p}`), as: () => facilitator },
  { method: 'POST', path: p => x(`/injects/${p}/release`), as: () => facilitator },
  { method: 'POST', path: p => x(`/injects/${p}/hold`), as: () => facilitator },
  { method: 'POST', path: p => x(`/solutions/${p}/publish`), as: () => facilitator },
  { method: 'DELETE', path: p => x(`/members/${p}`), as: () => facilitator },
  { method: 'DELETE', path: p => x(`/wall-tokens/${p}`), as: () => facilitator },
  { method: 'DELETE', path: p => x(`/findings/${p}`), as: () => analyst },
  { method: 'DELETE', path: p => x(`/improvements/${p}`), as: () => analyst },
  { method: 'PUT', path: p => x(`/hotwash/${p}`), as: () => analyst },
  { method: 'GET', path: p => x(`/review/solutions/${p}`), as: () => analyst },
  { method: 'GET', path: p => `/api/scenarios/${p}`, as: () => facilitator },
  { method: 'DELETE', path: p => `/api/scenarios/${p}`, as: () => facilitator },
  { method: 'POST', path: p => `/api/scenarios/${p}/duplicate`, as: () => facilitator },
  { method: 'GET', path: p => `/api/scenarios/${p}/export`, as: () => facilitator },
  { method: 'GET', path: p => `/api/scenarios/${scenarioId}/attachments/${p}`, as: () => facilitator },
  { method: 'GET', path: p => `/api/wall/${p}`, as: () => anonymous },
]
const TRAVERSAL = [
  '..',
  '../..',
  '..%2F..%2Fetc%2Fpasswd',
  '%2e%2e%2f%2e%2e%2f',
  '..\\..\\windows',
  '%00',
  '.%00.',
  '%252e%252e%252f',
  '....//....//',
  '/etc/passwd',
  'a'.repeat(5000),
  '%C0%AE%C0%AE%2F',
  '~',
  '*',
  '%ff%fe',
]

async function upload(who: Http, path: string, name: string, bytes: Uint8Array | string, type = 'application/octet-stream') {
  const form = new FormData()
  form.append('file', new Blob([bytes as BlobPart], { type }), name)
  return who.call('POST', path, form)
}

beforeAll(async () => {
  await server.init()
  await server.start()
  admin = await Http.signIn(server.base, DEMO.admin)
  facilitator = await Http.signIn(server.base, DEMO.facilitator)
  science = await Http.signIn(server.base, DEMO.science)
  evaluator = await Http.signIn(server.base, DEMO.evaluator)
  analyst = await Http.signIn(server.base, DEMO.analyst)
  anonymous = new Http(server.base)
  const d = await demoScenario(facilitator)
  demo = d.document
  scenarioId = (await facilitator.post(`/api/scenarios/${d.id}/duplicate`)).json.id
  exerciseId = (await facilitator.post(`/api/scenarios/${d.id}/exercises`, { title: 'Input drill' })).json.id
  for (const [email, role, teamKey] of [
    [DEMO.science, 'player', 'science'],
    [DEMO.evaluator, 'evaluator', null],
    [DEMO.analyst, 'analyst', null],
  ] as const) {
    expect((await facilitator.post(x('/members'), { email, role, teamKey })).status).toBe(201)
  }
  scienceId = (await science.get('/api/me')).json.user.id
  // Started and paused at once: nothing falls due while the data is compared.
  expect((await facilitator.post(x('/clock'), { action: 'start' })).status).toBe(200)
  expect((await facilitator.post(x('/clock'), { action: 'pause' })).status).toBe(200)
}, 120_000)

afterAll(async () => {
  const total = Object.values(tried).reduce((a, b) => a + b, 0)
  console.info(`[malformed-input] ${total} bad inputs tried: ${Object.entries(tried).map(([k, v]) => `${k} ${v}`).join(', ')}`)
  await server.dispose()
})

describe('random and malformed bodies', () => {
  for (const route of BODY_ROUTES) {
    it(`${route.method} ${route.name}: a broken body is a 400 with field issues and changes nothing`, async () => {
      await untouched(async () => {
        const accepted = (b: unknown) => route.schema.safeParse(b ?? {}).success && (route.alsoValid?.(b) ?? true)
        const invalid = brokenBodies(route.valid()).filter(b => !accepted(b))
        await fc.assert(fc.asyncProperty(invalid, async (body) => {
          const res = await route.as().call(route.method, route.path(), JSON.stringify(body), { 'content-type': 'application/json' })
          count('json bodies')
          expectClear4xx(res, `${route.name} ${JSON.stringify(body).slice(0, 120)}`)
          expect(res.status).toBe(400)
        }), { numRuns: RUNS })
      })
    }, 60_000)
  }

  it('text that is not JSON, prototype keys and truncated JSON are 400s', async () => {
    await untouched(async () => {
      const raw = fc.oneof(
        fc.string({ maxLength: 300 }),
        fc.constantFrom(
          '{',
          '{"a":',
          '[1,2',
          '"unterminated',
          '{"__proto__":{"isAdmin":true}}',
          '{"constructor":{"prototype":{"polluted":1}}}',
          'null',
          'true',
          '1e309',
          '\u0000',
          '{"a":1}{"b":2}',
        ),
        fc.jsonValue().map(v => JSON.stringify(v).slice(0, -1)),
      )
      await fc.assert(fc.asyncProperty(raw, fc.constantFrom(...BODY_ROUTES), async (text, route) => {
        // What the route would read (h3 parses JSON, else keeps the text; no body reads as {}): skip what is valid.
        let parsed: unknown
        try { parsed = JSON.parse(text) }
        catch { parsed = text.trim() ? text : undefined }
        fc.pre(!route.schema.safeParse(parsed ?? {}).success)
        const res = await route.as().call(route.method, route.path(), text, { 'content-type': 'application/json' })
        count('raw text bodies')
        expectClear4xx(res, `${route.name} ${JSON.stringify(text).slice(0, 80)}`)
      }), { numRuns: RUNS * 6 })
    })
  }, 120_000)

  it('a body sent as another content type is refused with 415, even when it is valid JSON', async () => {
    await untouched(async () => {
      const types = fc.constantFrom(
        'text/plain',
        'text/plain;charset=UTF-8',
        'application/x-www-form-urlencoded',
        'multipart/form-data; boundary=x',
        'application/xml',
        'text/html',
        'application/jsonp',
        'application/json-patch',
        'image/png',
      )
      await fc.assert(fc.asyncProperty(types, fc.constantFrom(...BODY_ROUTES), async (type, route) => {
        const res = await route.as().call(route.method, route.path(), JSON.stringify(route.valid()), { 'content-type': type })
        count('wrong content types')
        expectClear4xx(res, `${route.name} as ${type}`)
        expect(res.status).toBe(415)
      }), { numRuns: RUNS * 3 })
    })
  }, 60_000)

  it('an oversized request body is refused before it is read (413)', async () => {
    await untouched(async () => {
      for (const route of BODY_ROUTES.slice(0, 6)) {
        const res = await route.as().call(
          route.method,
          route.path(),
          `{"a":"${'x'.repeat(7 * 1024 * 1024)}"}`,
          { 'content-type': 'application/json' },
        )
        count('oversized bodies')
        expectClear4xx(res, route.name)
        expect(res.status).toBe(413)
      }
    })
  }, 60_000)
})

describe('random route parameters and queries', () => {
  it('every route with parameters answers random and traversal parameters with a 4xx', async () => {
    await untouched(async () => {
      const param = fc.oneof(fc.string({ minLength: 1, maxLength: 80 }).map(encodeURIComponent), fc.constantFrom(...TRAVERSAL), fc.uuid())
      await fc.assert(fc.asyncProperty(fc.constantFrom(...PARAM_ROUTES), param, async (route, p) => {
        const res = await route.as().call(route.method, route.path(p))
        count('route parameters')
        // A dot segment may be folded by URL parsing into another route; whatever answers must not be a 5xx.
        expect(res.status, `${route.method} ${route.path(p).slice(0, 120)} → ${res.status} ${res.text.slice(0, 120)}`).toBeLessThan(500)
        if (res.headers.get('content-type')?.includes('json') && res.status >= 400) expectClear4xx(res, route.path(p).slice(0, 120))
      }), { numRuns: RUNS * 10 })
    })
  }, 120_000)

  it('random queries of the event record and the importer are validated', async () => {
    await untouched(async () => {
      const value = fc.oneof(
        fc.string({ maxLength: 30 }),
        fc.integer().map(String),
        fc.constantFrom('-1', '1e9', 'NaN', 'Infinity', '0x10', '[]', '%00'),
      )
      await fc.assert(fc.asyncProperty(value, value, async (since, limit) => {
        const res = await facilitator.get(x(`/events?since=${encodeURIComponent(since)}&limit=${encodeURIComponent(limit)}`))
        count('queries')
        expect([200, 400], `since=${since} limit=${limit}`).toContain(res.status)
      }), { numRuns: RUNS * 3 })
      await fc.assert(fc.asyncProperty(fc.string({
        minLength: 1,
        maxLength: 20,
      }).filter(s => !['refuse', 'copy', 'replace'].includes(s)), async (onConflict) => {
        const res = await upload(
          facilitator,
          `/api/scenarios/import?onConflict=${encodeURIComponent(onConflict)}`,
          'x.yaml',
          stringifyScenario(demo),
        )
        count('queries')
        expectClear4xx(res, `onConflict=${onConflict}`)
      }), { numRuns: RUNS })
    })
  }, 60_000)
})

describe('the scenario importer', () => {
  const importFile = (name: string, bytes: Uint8Array | string) => upload(facilitator, '/api/scenarios/import?onConflict=copy', name, bytes)

  it('random text, random YAML and broken scenario files are 400s with the problem located', async () => {
    await untouched(async () => {
      const valid = stringifyScenario(demo)
      const files = fc.oneof(
        fc.string({ maxLength: 2000 }),
        fc.jsonValue().map(v => yamlStringify(v)),
        // The demo file with one line replaced by random text, or cut short.
        fc.tuple(fc.nat(), fc.string({ maxLength: 60 })).map(([i, s]) => {
          const lines = valid.split('\n')
          lines[i % lines.length] = s
          return lines.join('\n')
        }),
        fc.nat().map(n => valid.slice(0, n % valid.length)),
        fc.constantFrom(
          '!!js/function "function () { return 1 }"',
          'a: !!binary aGVsbG8=',
          'key: !custom-tag x',
          '%YAML 2.0\n---\na: 1',
          'a: 1\na: 2',
          '<<: *missing',
          '- &a [*a]',
        ),
      ).filter(text => !parseScenarioYaml(text).ok)
      await fc.assert(fc.asyncProperty(files, async (text) => {
        const res = await importFile('random.yaml', text)
        count('scenario files')
        expectClear4xx(res, `import ${JSON.stringify(text).slice(0, 100)}`)
      }), { numRuns: RUNS * 3 })
    })
  }, 120_000)

  it('YAML alias bombs are refused quickly, without expanding', async () => {
    await untouched(async () => {
      await fc.assert(fc.asyncProperty(fc.integer({ min: 3, max: 12 }), fc.integer({ min: 2, max: 12 }), async (levels, width) => {
        const lines = ['a0: &a0 ["lol","lol","lol","lol","lol","lol","lol","lol","lol"]']
        for (let i = 1; i <= levels; i++) lines.push(`a${i}: &a${i} [${Array.from({ length: width }, () => `*a${i - 1}`).join(',')}]`)
        const t0 = Date.now()
        const res = await importFile('bomb.yaml', lines.join('\n'))
        count('alias bombs')
        expectClear4xx(res, `bomb ${levels}×${width}`)
        expect(res.status).toBe(400)
        expect(Date.now() - t0).toBeLessThan(2000)
      }), { numRuns: RUNS })
    })
  }, 120_000)

  it('oversized, empty, non-UTF-8 and misplaced scenario files are refused', async () => {
    await untouched(async () => {
      const cases: Array<[string, () => Promise<Answer>, number]> = [
        ['over 1 MiB', () => importFile('big.yaml', `# ${'x'.repeat(1024 * 1024 + 10)}`), 413],
        [
          'over 1 MiB declared',
          () => facilitator.call(
            'POST',
            '/api/scenarios/import',
            'x'.repeat(2 * 1024 * 1024),
            { 'content-type': 'multipart/form-data; boundary=zzz' },
          ),
          413,
        ],
        ['empty', () => importFile('empty.yaml', ''), 400],
        ['not UTF-8', () => importFile('latin1.yaml', new Uint8Array([0x6b, 0x65, 0x79, 0x3a, 0x20, 0xe9, 0xff, 0xfe])), 400],
        [
          'JSON instead of a file',
          () => facilitator.call(
            'POST',
            '/api/scenarios/import',
            JSON.stringify({ file: stringifyScenario(demo) }),
            { 'content-type': 'application/json' },
          ),
          400,
        ],
        ['another field name', async () => {
          const form = new FormData()
          form.append('document', new Blob([stringifyScenario(demo)]), 'x.yaml')
          return facilitator.call('POST', '/api/scenarios/import', form)
        }, 400],
        [
          'broken multipart',
          () => facilitator.call(
            'POST',
            '/api/scenarios/import',
            '--zzz\r\nContent-Disposition: form-data; name="file"\r\n\r\nabc',
            { 'content-type': 'multipart/form-data; boundary=zzz' },
          ),
          400,
        ],
      ]
      for (const [what, call, status] of cases) {
        const res = await call()
        count('scenario files')
        expectClear4xx(res, what)
        expect(res.status, what).toBe(status)
      }
    })
  }, 60_000)
})

describe('attachments', () => {
  const attach = (name: string, bytes: Uint8Array | string) => upload(facilitator, `/api/scenarios/${scenarioId}/attachments`, name, bytes)

  it('oversized and disallowed files are refused (413, 415) and change nothing', async () => {
    await untouched(async () => {
      const big = await attach('big.pdf', new Uint8Array(5 * 1024 * 1024 + 1).fill(0x25))
      count('attachments')
      expect(big.status).toBe(413)
      const types = fc.oneof(
        fc.tuple(
          fc.constantFrom('x.exe', 'x.html', 'x.svg', 'x.js', 'x.yaml', 'x', 'x.pdf', 'x.png', '.md'),
          fc.uint8Array({ minLength: 1, maxLength: 2000 }),
        )
          .filter(([name, bytes]) => !(/\.(md|txt|csv)$/.test(name) && !bytes.includes(0) && (() => {
            try { new TextDecoder('utf-8', { fatal: true }).decode(bytes); return true }
            catch { return false }
          })())),
        fc.constant(['page.html', '<html><script>alert(1)</script></html>'] as [string, string]),
        fc.constant(['image.svg', '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'] as [string, string]),
      )
      await fc.assert(fc.asyncProperty(types, async ([name, bytes]) => {
        const res = await attach(name, bytes)
        count('attachments')
        expectClear4xx(res, `attach ${name}`)
        expect([400, 415]).toContain(res.status)
      }), { numRuns: RUNS * 2 })
    })
  }, 60_000)

  it('path traversal in an attachment name never leaves the scenario folder or the storage', async () => {
    const names = fc.oneof(
      fc.constantFrom(
        '../../etc/passwd.txt',
        '..\\..\\windows\\win.ini.txt',
        '/etc/shadow.md',
        '....//....//x.csv',
        '..%2F..%2Fx.txt',
        'a/../../b.md',
        '.hidden.md',
        '..',
        '.',
        'C:\\x\\y.txt',
        'x.txt\u0000.pdf',
        '\u202Etxt.md',
      ),
      fc.tuple(
        fc.array(fc.constantFrom('..', '.', '/', '\\', 'a', '%2e', '%2f', '\u0000'), { maxLength: 12 }),
        fc.constantFrom('.md', '.txt', '.csv'),
      ).map(([parts, ext]) => parts.join('') + ext),
    )
    const storage = join(server.dir, 'attachments')
    await untouched(async () => {
      await fc.assert(fc.asyncProperty(names, async (name) => {
        const res = await attach(name, 'plain text')
        count('attachment names')
        expect(res.status, `${JSON.stringify(name)} → ${res.status} ${res.text.slice(0, 100)}`).toBeLessThan(500)
        if (res.status === 201) {
          // Three segments: the folder, the scenario key, a plain file name that is not a dot name.
          expect(res.json.path).toMatch(/^attachments\/[a-z0-9-]+\/[\w-][\w.-]*$/)
        }
      }), { numRuns: RUNS * 2 })
    }, ['scenario_attachments', 'audit_log'])
    expect((await attach('../../etc/passwd.txt', 'plain text')).json.path).toMatch(/^attachments\/[a-z0-9-]+\/passwd\.txt$/)
    // Only the database folder holds files; the blobs are named by their hash.
    const walk = (dir: string): string[] =>
      readdirSync(dir).flatMap(n => (statSync(join(dir, n)).isDirectory() ? walk(join(dir, n)) : [join(dir, n)]))
    for (const file of walk(server.dir)) expect(file.slice(server.dir.length)).toMatch(/^\/(hard\.sqlite(-wal|-shm)?|attachments\/[0-9a-f]{2}\/[0-9a-f]{64})$/)
    expect(walk(storage).length).toBeGreaterThan(0)
    const rows = (await facilitator.get(`/api/scenarios/${scenarioId}`)).json.attachments as Array<{ id: string; path: string }>
    const one = rows.find(r => r.path.endsWith('passwd.txt'))!
    const download = await facilitator.call('GET', `/api/scenarios/${scenarioId}/attachments/${one.id}`)
    expect(download.headers.get('content-disposition')).toMatch(/^attachment; filename="[\w.-]+"$/)
    expect(download.headers.get('content-security-policy')).toMatch(/sandbox/)
    expect(download.headers.get('x-content-type-options')).toBe('nosniff')
  }, 60_000)
})

describe('markdown with HTML in inject bodies', () => {
  const PAYLOADS = [
    '<script>alert("x")</script>',
    '<img src=x onerror="alert(1)">',
    '<a href="javascript:alert(1)">link</a> and [md link](javascript:alert(1))',
    '<svg onload=alert(1)><iframe srcdoc="<script>alert(1)</script>">',
    '**bold** <div onmouseover="alert(1)">hover</div>',
  ]

  it('is stored and delivered as the markdown text it is, never turned into HTML by the server', async () => {
    for (const [i, body] of PAYLOADS.entries()) {
      const res = await facilitator.post(
        x('/messages'),
        { teams: ['science'], title: `Payload ${i}`, body, kind: 'message', idempotencyKey: `payload-${i}-0000` },
      )
      count('markdown payloads')
      expect(res.status).toBe(201)
      expect(res.json.event.data.body).toBe(body)
    }
    const seen = (await science.get(x('/events'))).json.events.filter((e: { type: string }) => e.type === 'message.sent')
    expect(seen.map((e: { data: { body: string } }) => e.data.body)).toEqual(PAYLOADS)
    const live = (await science.get(x('/live'))).json
    expect(JSON.stringify(live)).toContain(JSON.stringify(PAYLOADS[1]).slice(1, -1))
  })

  it('an imported scenario with such bodies keeps them as text', async () => {
    const doc = { ...structuredClone(demo), key: 'payload-scenario', title: 'Payloads' }
    doc.injects[0]!.body = PAYLOADS.join('\n\n')
    const res = await upload(facilitator, '/api/scenarios/import?onConflict=copy', 'p.yaml', stringifyScenario(doc))
    count('markdown payloads')
    expect(res.status).toBe(201)
    const saved = (await facilitator.get(`/api/scenarios/${res.json.id}`)).json.document as Scenario
    expect(saved.injects[0]!.body).toBe(PAYLOADS.join('\n\n'))
  })
})

describe('formula injection in exports', () => {
  it('no CSV or XLSX cell starts a formula, whatever players and evaluators write', async () => {
    const released = demo.injects.find(i => !i.contingency && i.teams.includes('science'))!.key
    await facilitator.post(x(`/injects/${released}/release`))
    const formula = fc.tuple(fc.constantFrom('=', '+', '-', '@', '\t', '\r', '=cmd|', '@SUM('), fc.string({ minLength: 1, maxLength: 40 }))
      .map(([a, b]) => `${a}${b}`).filter(s => s.trim().length > 0)
    let n = 0
    await fc.assert(fc.asyncProperty(formula, async (text) => {
      n++
      const key = `formula-${n}-${Date.now()}`
      const r = await science.post(x('/responses'), { injectKey: released, text, idempotencyKey: key })
      const o = await evaluator.post(x('/observations'), { text, idempotencyKey: key })
      count('formula cells', 2)
      expect([r.status, o.status]).toEqual([201, 201])
    }), { numRuns: RUNS })
    const csv = await facilitator.call('GET', x('/timeline.csv'))
    expect(csv.status).toBe(200)
    const cells = Papa.parse<string[]>(csv.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true, delimiter: ',' }).data.flat()
    expect(cells.filter(c => /^[=+\-@\t\r]/.test(c))).toEqual([])
    expect(cells.filter(c => /^'[=+\-@\t\r]/.test(c)).length).toBeGreaterThanOrEqual(RUNS)
    const xlsx = await fetch(`${server.base}${x('/timeline.xlsx')}`, { headers: { cookie: facilitator.cookie } })
    const book = new ExcelJS.Workbook()
    await book.xlsx.load(Buffer.from(await xlsx.arrayBuffer()) as unknown as ArrayBuffer)
    const values: unknown[] = []
    book.eachSheet(sheet => sheet.eachRow(row => row.eachCell((cell) => {
      values.push(cell.value)
      expect(cell.type, `a formula cell at ${cell.address}`).not.toBe(ExcelJS.ValueType.Formula)
    })))
    expect(values.filter(v => typeof v === 'string' && /^[=+\-@\t\r]/.test(v))).toEqual([])
  }, 120_000)
})

describe('the server after all this', () => {
  it('is up and logged no unhandled error', async () => {
    expect((await anonymous.get('/api/health')).status).toBe(200)
    expect(server.log).not.toMatch(/\[unhandled\]|\[request error\]/)
  })
})
