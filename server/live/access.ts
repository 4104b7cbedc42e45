import type { H3Event } from 'h3'
import type { ExerciseRole } from '#shared/utils/roles'
import { idParamSchema } from '#shared/schemas/auth'
import { viewOf } from './record'

/**
 * The guard of the live exercise routes, in the house order: signed in (401) → a valid exercise id
 * (400) → one of `roles` in that exercise (404 for non-members, 403 for other roles). Returns the
 * access and the reader view that filters and sanitises events.
 */
export async function requireLiveRole(event: H3Event, roles: readonly ExerciseRole[], opts: { allowAdmin?: boolean } = {}) {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const access = await requireExerciseRole(event, id, roles, opts)
  return { exerciseId: id, ...access, view: viewOf(access.membership) }
}
