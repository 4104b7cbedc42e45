import { sql } from 'drizzle-orm'
import { index, integer, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core'
import { EXERCISE_ROLES, SYSTEM_ROLES } from '../../shared/utils/roles'

const id = () => text('id').primaryKey().$defaultFn(() => crypto.randomUUID())
const timestamps = {
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(sql`(unixepoch('subsec') * 1000)`).$onUpdate(() => new Date()),
}

export const users = sqliteTable('users', {
  id: id(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash'),
  systemRole: text('system_role', { enum: SYSTEM_ROLES }).notNull().default('member'),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  ...timestamps,
}, t => [uniqueIndex('users_email_unique').on(t.email)])

export const exercises = sqliteTable('exercises', {
  id: id(),
  title: text('title').notNull(),
  description: text('description').notNull().default(''),
  status: text('status', { enum: ['planned', 'running', 'paused', 'ended'] }).notNull().default('planned'),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [index('exercises_created_by_idx').on(t.createdBy)])

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
