import { sql } from 'drizzle-orm'
import { index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import { EXERCISE_ROLES, SYSTEM_ROLES } from '../../shared/utils/roles'
import type { Scenario } from '../../shared/scenario/schema'
import type { Audience, EventDataMap, InjectDefinition, LiveEventType } from '../../shared/live/types'
import { FINDING_KINDS, HOTWASH_KEYS, ITEM_STATUSES, POETE_ELEMENTS } from '../../shared/review/plan'

const id = () => text('id').primaryKey().$defaultFn(() => crypto.randomUUID())
const timestamps = {
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  updatedAt: integer(
    'updated_at',
    { mode: 'timestamp_ms' },
  ).notNull().default(sql`(unixepoch('subsec') * 1000)`).$onUpdate(() => new Date()),
}

export const users = sqliteTable('users', {
  id: id(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash'),
  systemRole: text('system_role', { enum: SYSTEM_ROLES }).notNull().default('member'),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  /** May use the scenario library and start exercises (admins always may). */
  canAuthor: integer('can_author', { mode: 'boolean' }).notNull().default(false),
  /** Sessions carry the generation they were opened under; bumping it (password set or reset) ends them all. */
  sessionGeneration: integer('session_generation').notNull().default(0),
  ...timestamps,
}, t => [uniqueIndex('users_email_unique').on(t.email)])

/** Facts about this database itself; `epoch` names one history of the event record (a restored copy gets a new one). */
export const appMeta = sqliteTable('app_meta', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
})

/** Sessions ended by signing out, kept until their cookie would have expired anyway. */
export const revokedSessions = sqliteTable('revoked_sessions', {
  sessionId: text('session_id').primaryKey(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
})

/** The scenario library: each scenario is one validated document (the YAML file's content). */
export const scenarios = sqliteTable('scenarios', {
  id: id(),
  key: text('key').notNull(),
  title: text('title').notNull(),
  document: text('document', { mode: 'json' }).$type<Scenario>().notNull(),
  /** Bumped on every save; a save must name the revision it edited (lost-update guard). */
  revision: integer('revision').notNull().default(1),
  origin: text('origin', { enum: ['seed', 'upload', 'editor', 'duplicate'] }).notNull(),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('scenarios_key_unique').on(t.key),
  index('scenarios_created_by_idx').on(t.createdBy),
  index('scenarios_updated_by_idx').on(t.updatedBy),
])

/** Files that injects attach, by the path the scenario file uses; bytes live in Nitro storage by hash. */
export const scenarioAttachments = sqliteTable('scenario_attachments', {
  id: id(),
  scenarioId: text('scenario_id').notNull().references(() => scenarios.id, { onDelete: 'cascade' }),
  path: text('path').notNull(),
  name: text('name').notNull(),
  contentType: text('content_type').notNull(),
  size: integer('size').notNull(),
  sha256: text('sha256').notNull(),
  ...timestamps,
}, t => [uniqueIndex('scenario_attachments_path_unique').on(t.scenarioId, t.path)])

export const exercises = sqliteTable('exercises', {
  id: id(),
  title: text('title').notNull(),
  description: text('description').notNull().default(''),
  status: text('status', { enum: ['planned', 'running', 'paused', 'ended'] }).notNull().default('planned'),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  /** The library scenario it started from (null once that is deleted). */
  scenarioId: text('scenario_id').references(() => scenarios.id, { onDelete: 'set null' }),
  /** The copy frozen at start: later edits to the library scenario do not reach this drill. */
  scenario: text('scenario', { mode: 'json' }).$type<Scenario>(),
  /** Bytes of free text people have written into the event record (answers, messages, notes): held under a cap. */
  recordBytes: integer('record_bytes').notNull().default(0),
  ...timestamps,
}, t => [index('exercises_created_by_idx').on(t.createdBy), index('exercises_scenario_idx').on(t.scenarioId)])

/** The attachments frozen with an exercise's scenario copy. */
export const exerciseAttachments = sqliteTable('exercise_attachments', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  path: text('path').notNull(),
  name: text('name').notNull(),
  contentType: text('content_type').notNull(),
  size: integer('size').notNull(),
  sha256: text('sha256').notNull(),
  ...timestamps,
}, t => [uniqueIndex('exercise_attachments_path_unique').on(t.exerciseId, t.path)])

export const memberships = sqliteTable('memberships', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: EXERCISE_ROLES }).notNull(),
  teamKey: text('team_key'),
  ...timestamps,
}, t => [
  uniqueIndex('memberships_exercise_user_unique').on(t.exerciseId, t.userId),
  index('memberships_user_idx').on(t.userId),
])

/** Single-use, expiring tokens for invitations and password resets; only the SHA-256 hash is kept. */
export const accountTokens = sqliteTable('account_tokens', {
  id: id(),
  userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: ['invite', 'reset'] }).notNull(),
  tokenHash: text('token_hash').notNull(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  usedAt: integer('used_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [uniqueIndex('account_tokens_hash_unique').on(t.tokenHash), index('account_tokens_user_idx').on(t.userId)])

/** Admin actions, append-only. */
export const auditLog = sqliteTable('audit_log', {
  id: id(),
  actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
  action: text('action').notNull(),
  target: text('target'),
  data: text('data', { mode: 'json' }).$type<Record<string, unknown>>(),
  ...timestamps,
}, t => [index('audit_log_actor_idx').on(t.actorId)])

/** Messages caught by the development SMTP catcher (never used when a real relay is configured). */
export const caughtMail = sqliteTable('caught_mail', {
  id: id(),
  from: text('from_addr').notNull(),
  to: text('to_addr').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  attachments: text('attachments', { mode: 'json' }).$type<Array<{ filename: string; contentType: string; size: number }>>().notNull(),
  ...timestamps,
})

/** The clock of a running exercise: scenario time = scenarioAnchor + (now − wallAnchor) × factor unless paused (shared/live/clock.ts). */
export const exerciseClocks = sqliteTable('exercise_clocks', {
  exerciseId: text('exercise_id').primaryKey().references(() => exercises.id, { onDelete: 'cascade' }),
  /** Wall time of the last change, ms since the epoch. */
  wallAnchor: integer('wall_anchor').notNull(),
  /** Scenario time at the wall anchor, ms since the epoch. */
  scenarioAnchor: integer('scenario_anchor').notNull(),
  /** Scenario milliseconds per wall millisecond. */
  factor: real('factor').notNull(),
  paused: integer('paused', { mode: 'boolean' }).notNull(),
  ...timestamps,
})

/**
 * The append-only record of an exercise. `seq` counts from 1 per exercise; `audience` says who may
 * read it: `all`, `control` (facilitator), `evaluators` (evaluators, analysts, facilitator) or
 * `teams:<key>[,<key>…]` (those teams' players, plus staff). See shared/live/visibility.ts.
 */
export const exerciseEvents = sqliteTable('exercise_events', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  seq: integer('seq').notNull(),
  type: text('type').$type<LiveEventType>().notNull(),
  wallTime: integer('wall_time').notNull(),
  scenarioTime: integer('scenario_time').notNull(),
  actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
  audience: text('audience').$type<Audience>().notNull(),
  payload: text('payload', { mode: 'json' }).$type<EventDataMap[LiveEventType]>().notNull(),
  /** A client's key for a write it may retry: one event per (exercise, actor, key). */
  idempotencyKey: text('idempotency_key'),
}, t => [
  uniqueIndex('exercise_events_seq_unique').on(t.exerciseId, t.seq),
  uniqueIndex('exercise_events_idempotency_unique').on(t.exerciseId, t.actorId, t.idempotencyKey),
  index('exercise_events_actor_idx').on(t.actorId),
])

/** Held and released injects (scenario ones and ad-hoc messages): one row per inject, so a release happens once. */
export const exerciseInjects = sqliteTable('exercise_injects', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  injectKey: text('inject_key').notNull(),
  status: text('status', { enum: ['held', 'released'] }).notNull(),
  /** Ad-hoc messages only: what the facilitator wrote (scenario injects live in the frozen scenario). */
  definition: text('definition', { mode: 'json' }).$type<InjectDefinition>(),
  releasedSeq: integer('released_seq'),
  /** The solution the current body was rendered against (null: no hazard fields, or none published yet). */
  solutionKey: text('solution_key'),
  /** The current rendered body. */
  body: text('body'),
  revision: integer('revision').notNull().default(0),
  ...timestamps,
}, t => [uniqueIndex('exercise_injects_key_unique').on(t.exerciseId, t.injectKey)])

/** Published orbit solutions: one row per solution, pointing at its `solution.published` event (which holds the assessment). */
export const exerciseSolutions = sqliteTable('exercise_solutions', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  solutionKey: text('solution_key').notNull(),
  seq: integer('seq').notNull(),
  ...timestamps,
}, t => [uniqueIndex('exercise_solutions_key_unique').on(t.exerciseId, t.solutionKey)])

/** Revocable share links of the wall view; only the SHA-256 hash of the token is kept. */
export const wallTokens = sqliteTable('wall_tokens', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  label: text('label').notNull().default(''),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  ...timestamps,
}, t => [
  uniqueIndex('wall_tokens_hash_unique').on(t.tokenHash),
  index('wall_tokens_exercise_idx').on(t.exerciseId),
  index('wall_tokens_created_by_idx').on(t.createdBy),
])

/** After-action findings: strengths and areas for improvement, tied to an objective and a capability. Not drill events. */
export const exerciseFindings = sqliteTable('exercise_findings', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: FINDING_KINDS }).notNull(),
  objectiveKey: text('objective_key').notNull(),
  capability: text('capability').notNull(),
  title: text('title').notNull(),
  detail: text('detail').notNull().default(''),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('exercise_findings_exercise_idx').on(t.exerciseId),
  index('exercise_findings_created_by_idx').on(t.createdBy),
  index('exercise_findings_updated_by_idx').on(t.updatedBy),
])

/** The improvement plan: corrective actions with a capability element (POETE), owner, dates and status. */
export const improvementItems = sqliteTable('improvement_items', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  /** The area for improvement it answers (null once that finding is deleted, or when none was named). */
  findingId: text('finding_id').references(() => exerciseFindings.id, { onDelete: 'set null' }),
  objectiveKey: text('objective_key').notNull(),
  capability: text('capability').notNull(),
  action: text('action').notNull(),
  element: text('element', { enum: POETE_ELEMENTS }).notNull(),
  owner: text('owner').notNull(),
  /** Calendar dates, YYYY-MM-DD. */
  startDate: text('start_date').notNull(),
  dueDate: text('due_date').notNull(),
  status: text('status', { enum: ITEM_STATUSES }).notNull().default('open'),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('improvement_items_exercise_idx').on(t.exerciseId),
  index('improvement_items_finding_idx').on(t.findingId),
  index('improvement_items_created_by_idx').on(t.createdBy),
  index('improvement_items_updated_by_idx').on(t.updatedBy),
])

/** One participant's feedback on a drill (sent again, it replaces the earlier answers). */
export const feedbackResponses = sqliteTable('feedback_responses', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  /** 1..5 per question key of FEEDBACK_QUESTIONS. */
  ratings: text('ratings', { mode: 'json' }).$type<Record<string, number>>().notNull(),
  wentWell: text('went_well').notNull().default(''),
  toImprove: text('to_improve').notNull().default(''),
  ...timestamps,
}, t => [
  uniqueIndex('feedback_responses_exercise_user_unique').on(t.exerciseId, t.userId),
  index('feedback_responses_user_idx').on(t.userId),
])

/** Feedback forms sent by e-mail: one row per member and sending. */
export const feedbackRequests = sqliteTable('feedback_requests', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  sentBy: text('sent_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  index('feedback_requests_exercise_idx').on(t.exerciseId),
  index('feedback_requests_user_idx').on(t.userId),
  index('feedback_requests_sent_by_idx').on(t.sentBy),
])

/** Hotwash notes: one editable text per section; `revision` guards against lost updates. */
export const hotwashNotes = sqliteTable('hotwash_notes', {
  id: id(),
  exerciseId: text('exercise_id').notNull().references(() => exercises.id, { onDelete: 'cascade' }),
  section: text('section', { enum: HOTWASH_KEYS }).notNull(),
  body: text('body').notNull().default(''),
  revision: integer('revision').notNull().default(1),
  updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('hotwash_notes_section_unique').on(t.exerciseId, t.section),
  index('hotwash_notes_updated_by_idx').on(t.updatedBy),
])

/**
 * Leases among the processes that share this database: the holder of `scheduler` runs the inject
 * scheduler. The holder renews `expiresAt` (wall ms) while it runs; another process takes the lease
 * once it has expired, or at once when the holder's process on this host is gone (server/utils/lease.ts).
 */
export const schedulerLeases = sqliteTable('scheduler_leases', {
  name: text('name').primaryKey(),
  /** `<host>/<pid>/<random>` of the holding process. */
  holder: text('holder').notNull(),
  expiresAt: integer('expires_at').notNull(),
  /** When the current holder took the lease (wall ms). */
  acquiredAt: integer('acquired_at').notNull(),
  ...timestamps,
})
