import { and, eq, lt } from 'drizzle-orm'
import type { UserSession } from '#auth-utils'
import type { H3Event } from 'h3'
import type { z } from 'zod'
import type { LiveView } from '#shared/live/types'
import { idParamSchema } from '#shared/schemas/auth'
import { hasCapability, viewOf, type Capability, type ExerciseStanding } from '#shared/utils/permissions'
import type { Membership, User } from '#shared/types/db'

/** A user by id if the account is active (null when unknown or disabled). */
export function activeUser(userId: string): User | null {
  const user = useDB().select().from(schema.users).where(eq(schema.users.id, userId)).get()
  return user && !user.disabled ? user : null
}

/** How long a session cookie lives (nuxt.config.ts `session.maxAge`), ms. */
const sessionMaxAgeMs = () => (Number(useRuntimeConfig().session.maxAge) || 12 * 3600) * 1000

/**
 * The active user of a session that is still alive: not signed out (its id not revoked) and opened under the user's
 * current session generation (a password set or reset ends every older session). Null otherwise.
 */
export function liveSessionUser(session: Pick<UserSession, 'user' | 'generation'> & { id?: string }): User | null {
  if (!session.user) return null
  const user = activeUser(session.user.id)
  if (!user || (session.generation ?? 0) !== user.sessionGeneration) return null
  if (session.id && useDB().select({ id: schema.revokedSessions.sessionId }).from(schema.revokedSessions)
    .where(eq(schema.revokedSessions.sessionId, session.id)).get()) return null
  return user
}

/** Ends one session for good: its cookie no longer opens anything, even if kept (sign-out). */
export function revokeSession(sessionId: string): void {
  const db = useDB()
  db.delete(schema.revokedSessions).where(lt(schema.revokedSessions.expiresAt, new Date())).run()
  db.insert(schema.revokedSessions).values({ sessionId, expiresAt: new Date(Date.now() + sessionMaxAgeMs()) })
    .onConflictDoNothing().run()
}

/** The signed-in, active user of a live session, read fresh from the database. Anonymous, disabled, signed out → 401. */
export async function requireUser(event: H3Event): Promise<User> {
  const session = await requireUserSession(event)
  const user = liveSessionUser(session)
  if (!user) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, message: 'Sign in again.' })
  }
  return user
}

/** The signed-in admin. Members → 403. */
export async function requireAdmin(event: H3Event): Promise<User> {
  const user = await requireUser(event)
  if (user.systemRole !== 'admin') throw createError({ statusCode: 403, message: 'Administrators only.' })
  return user
}

/** Admins and scenario authors: the scenario library and starting exercises. Others → 403. */
export async function requireAuthor(event: H3Event): Promise<User> {
  const user = await requireUser(event)
  if (user.systemRole !== 'admin' && !user.canAuthor) throw createError({
    statusCode: 403,
    message: 'Only scenario authors and administrators use the scenario library.',
  })
  return user
}

export interface ExerciseAccess {
  user: User
  exerciseId: string
  /** Null for an admin looking in without a drill role. */
  membership: Membership | null
  standing: ExerciseStanding
  /** The reader view that filters and sanitises the event record. */
  view: LiveView
}

/**
 * The access of a user to an exercise for one capability of the permission table (`shared/utils/permissions.ts`).
 * Not a member (or no such exercise), or an admin looking in where admins may not → 404, so that
 * existence does not leak; a member whose role lacks the capability → 403. Used by the HTTP guard and the live socket.
 */
export function exerciseAccess(user: User, exerciseId: string, capability: Capability): ExerciseAccess {
  const membership = useDB().select().from(schema.memberships)
    .where(and(eq(schema.memberships.exerciseId, exerciseId), eq(schema.memberships.userId, user.id))).get() ?? null
  if (!membership) {
    const exists = useDB().select({ id: schema.exercises.id }).from(schema.exercises).where(eq(schema.exercises.id, exerciseId)).get()
    if (exists && user.systemRole === 'admin' && hasCapability('admin-visitor', capability)) {
      return { user, exerciseId, membership: null, standing: 'admin-visitor', view: viewOf(null) }
    }
    throw notFound('No such exercise.')
  }
  if (!hasCapability(membership.role, capability)) throw forbidden('Your role in this exercise does not allow this.')
  return { user, exerciseId, membership, standing: membership.role, view: viewOf(membership) }
}

/**
 * The one guard of exercise routes, in the house order: signed in (401) → valid route parameters
 * with the exercise `id` (400) → the capability in that exercise (404 / 403, see `exerciseAccess`).
 * Reads the user once; returns the access with the validated parameters.
 */
export async function requireExerciseAccess<S extends z.ZodType<{ id: string }> = typeof idParamSchema>(
  event: H3Event,
  capability: Capability,
  paramsSchema?: S,
): Promise<ExerciseAccess & { params: z.output<S> }> {
  const user = await requireUser(event)
  const params = paramsValid(event, paramsSchema ?? idParamSchema) as z.output<S>
  const access = exerciseAccess(user, params.id, capability)
  // Every change to an exercise counts against its writer's limit (reads do not).
  if (event.method !== 'GET' && event.method !== 'HEAD') await consumeDrillWrite(event, user.id, params.id)
  return { ...access, params }
}

/** What the session keeps of a user (ids only; roles are always read from the database). */
export function sessionUser(user: User) {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    systemRole: user.systemRole,
    canAuthor: user.systemRole === 'admin' || user.canAuthor,
  }
}

/**
 * Signs a user in on a brand-new session (new id): the old cookie is cleared and dropped from
 * the request, so a session planted before sign-in is never carried over (session fixation).
 */
export async function startFreshSession(event: H3Event, user: User): Promise<void> {
  await clearUserSession(event)
  const name = useRuntimeConfig().session.name || 'nuxt-session'
  const header = event.node.req.headers.cookie
  if (header) {
    event.node.req.headers.cookie = header.split(';').map(c => c.trim()).filter(c => !c.startsWith(`${name}=`)).join('; ')
  }
  await setUserSession(event, { user: sessionUser(user), loggedInAt: Date.now(), generation: user.sessionGeneration })
}

/**
 * Who draws or withdraws a protective-action zone: the facilitator as `control`, a player for their team. An admin
 * looking in writes nothing (no such exercise for them, as on every write route); other roles may not (403).
 */
export function zoneAuthor(access: Pick<ExerciseAccess, 'user' | 'standing' | 'membership'>): { user: User; teamKey: string } {
  if (hasCapability(access.standing, 'live.control')) return { user: access.user, teamKey: 'control' }
  if (access.standing === 'admin-visitor' || !access.membership) throw notFound('No such exercise.')
  if (!hasCapability(access.standing, 'live.respond') || !access.membership.teamKey) throw forbidden('Your role in this exercise does not allow this.')
  return { user: access.user, teamKey: access.membership.teamKey }
}
