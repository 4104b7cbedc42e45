/** Request bodies, params and queries of the live exercise routes, and the socket handshake. */
import { z } from 'zod'
import { keySchema } from '../scenario/schema'
import { scenarioTimeSchema } from '../scenario/time'
import { MAX_FACTOR, MIN_FACTOR } from '../live/clock'
import { MAX_ZONE_CORNERS, MAX_ZONE_RADIUS_KM, polygonProblem } from '../geo/zones'

const uuid = z.string().uuid('Not a valid id.')

/** A client's key for a write it may retry (e.g. crypto.randomUUID()). */
export const idempotencyKeySchema = z.string().regex(/^[\w.:-]{8,128}$/, '8 to 128 letters, digits, "-", "_", "." or ":"')

export const injectParamsSchema = z.object({ id: uuid, key: keySchema })
export const solutionParamsSchema = z.object({ id: uuid, key: keySchema })
export const wallTokenParamsSchema = z.object({ id: uuid, tokenId: uuid })
export const wallParamsSchema = z.object({ token: z.string().regex(/^[\w-]{43}$/, 'Not a valid link.') })

const factorSchema = z.number().min(MIN_FACTOR, `at least ${MIN_FACTOR} (real time)`).max(MAX_FACTOR, `at most ${MAX_FACTOR}`)

export const clockActionSchema = z.object({
  action: z.enum(['start', 'pause', 'resume', 'speed', 'jump', 'end']),
  /** Scenario ms per wall ms, for `speed` (and optionally `start`). */
  factor: factorSchema.optional(),
  /** Scenario time to jump to. */
  to: scenarioTimeSchema.optional(),
  /** Jump to the next scheduled inject instead. */
  toNextInject: z.boolean().optional(),
  /**
   * A jump's injects that fall due on the way: `release` them now, each decision deadline moved by as much as the
   * release came late (the time the script allowed is kept); or `skip` them (held: control may release them by hand).
   */
  due: z.enum(['release', 'skip']).default('release'),
}).superRefine((v, ctx) => {
  if (v.action === 'speed' && v.factor === undefined) ctx.addIssue({ code: 'custom', path: ['factor'], message: 'Give the new speed.' })
  if (v.action === 'jump' && !v.to === !v.toNextInject) ctx.addIssue({
    code: 'custom',
    path: ['to'],
    message: 'Give either a scenario time or toNextInject.',
  })
})
export type ClockActionInput = z.infer<typeof clockActionSchema>
/** A clock action as a page sends it (defaults filled in by the server). */
export type ClockActionBody = z.input<typeof clockActionSchema>

export const messageSchema = z.object({
  teams: z.array(keySchema).min(1, 'Choose at least one team.').max(20),
  title: z.string().trim().min(1, 'Enter a title.').max(300),
  body: z.string().trim().min(1, 'Write the message.').max(20_000),
  kind: keySchema.default('message'),
  idempotencyKey: idempotencyKeySchema,
})

export const responseSchema = z.object({
  injectKey: keySchema,
  choice: z.string().trim().min(1).max(300).nullish(),
  text: z.string().trim().max(10_000).default(''),
  /** The revision of the inject on the answering team's screen (absent: the current one). */
  injectRevision: z.number().int().min(0).max(10_000).optional(),
  idempotencyKey: idempotencyKeySchema,
}).refine(r => !!r.choice || r.text.length > 0, { path: ['text'], message: 'Choose an option or write a response.' })

export const scoreSchema = z.object({
  criterionKey: keySchema,
  taskKey: keySchema,
  rating: z.enum(['P', 'S', 'M', 'U']),
  note: z.string().trim().max(4000).default(''),
  idempotencyKey: idempotencyKeySchema,
})

/** A team's message to control, or to another team through control. */
export const teamMessageSchema = z.object({
  to: z.union([z.literal('control'), keySchema]).default('control'),
  body: z.string().trim().min(1, 'Write the message.').max(4000),
  idempotencyKey: idempotencyKeySchema,
})

export const observationSchema = z.object({
  text: z.string().trim().min(1, 'Write the observation.').max(10_000),
  injectKey: keySchema.nullish(),
  teamKey: keySchema.nullish(),
  idempotencyKey: idempotencyKeySchema,
})

export const eventsQuerySchema = z.object({
  since: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(1000).default(500),
})

/** Releasing an inject: `force` confirms a release whose figures have no published solution yet. */
export const releaseSchema = z.object({ force: z.boolean().default(false) })

/** A page of the replay: the events after `after`, at most `limit`. */
export const replayQuerySchema = z.object({
  after: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(2000).default(1000),
})

export const wallTokenSchema = z.object({ label: z.string().trim().max(120).default('') })

/** The Socket.IO handshake `auth` of a live client: a member's exercise, or a wall's share token. */
export const liveAuthSchema = z.object({
  exerciseId: uuid.optional(),
  wallToken: z.string().max(100).optional(),
  lastSeq: z.coerce.number().int().min(0).default(0),
})

const zoneCornerSchema = z.tuple([z.number().min(-180).max(180), z.number().min(-85).max(85)])

/** A protective-action zone drawn on the hazard map: a circle or a polygon, its kind, name and a note. */
export const zoneSchema = z.object({
  kind: z.enum(['evacuate', 'shelter', 'exclusion']),
  name: z.string().trim().min(1, 'Name the zone.').max(80),
  note: z.string().trim().max(2000).default(''),
  shape: z.discriminatedUnion('type', [
    z.object({
      type: z.literal('circle'),
      centre: zoneCornerSchema,
      radiusKm: z.number().min(0.1, 'at least 0.1 km').max(MAX_ZONE_RADIUS_KM, `at most ${MAX_ZONE_RADIUS_KM} km`),
    }),
    z.object({
      type: z.literal('polygon'),
      ring: z.array(zoneCornerSchema).min(3, 'A zone needs at least three corners.').max(MAX_ZONE_CORNERS, `at most ${MAX_ZONE_CORNERS} corners`),
    }).superRefine((v, ctx) => {
      const problem = polygonProblem(v.ring)
      if (problem) ctx.addIssue({ code: 'custom', path: ['ring'], message: problem })
    }),
  ]),
  idempotencyKey: idempotencyKeySchema,
})
export type ZoneInput = z.infer<typeof zoneSchema>

export const zoneParamsSchema = z.object({ id: uuid, zoneId: uuid })
