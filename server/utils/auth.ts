import { and, eq } from 'drizzle-orm'
import type { H3Event } from 'h3'
import type { ExerciseRole } from '#shared/utils/roles'
import type { Membership, User } from '#shared/types/db'

/** The signed-in, active user, read fresh from the database. Anonymous or disabled → 401. */
export async function requireUser(event: H3Event): Promise<User> {
  const session = await requireUserSession(event)
  const user = useDB().select().from(schema.users).where(eq(schema.users.id, session.user.id)).get()
  if (!user || user.disabled) {
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
  if (user.systemRole !== 'admin' && !user.canAuthor) throw createError({ statusCode: 403, message: 'Only scenario authors and administrators use the scenario library.' })
  return user
}

export interface ExerciseAccess {
  user: User
  /** Null for an admin looking in without a drill role. */
  membership: Membership | null
}

/**
 * The one guard for exercise routes: the caller must hold one of `roles` in the exercise.
 * Not a member (or no such exercise) → 404, so existence does not leak; a member with
 * another role → 403. Admins pass only where `allowAdmin` is set (read-only views).
 */
export async function requireExerciseRole(
  event: H3Event,
  exerciseId: string,
  roles: readonly ExerciseRole[],
  opts: { allowAdmin?: boolean } = {},
): Promise<ExerciseAccess> {
  const user = await requireUser(event)
  const membership = useDB().select().from(schema.memberships)
    .where(and(eq(schema.memberships.exerciseId, exerciseId), eq(schema.memberships.userId, user.id))).get() ?? null
  if (!membership) {
    const exists = useDB().select({ id: schema.exercises.id }).from(schema.exercises).where(eq(schema.exercises.id, exerciseId)).get()
    if (exists && user.systemRole === 'admin' && opts.allowAdmin) return { user, membership: null }
    throw createError({ statusCode: 404, message: 'No such exercise.' })
  }
  if (!roles.includes(membership.role)) throw createError({ statusCode: 403, message: 'Your role in this exercise does not allow this.' })
  return { user, membership }
}

export const ALL_EXERCISE_ROLES: readonly ExerciseRole[] = ['facilitator', 'player', 'evaluator', 'analyst']

/** What the session keeps of a user (ids only; roles are always read from the database). */
export function sessionUser(user: User) {
  return { id: user.id, email: user.email, name: user.name, systemRole: user.systemRole, canAuthor: user.systemRole === 'admin' || user.canAuthor }
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
  await setUserSession(event, { user: sessionUser(user), loggedInAt: Date.now() })
}
