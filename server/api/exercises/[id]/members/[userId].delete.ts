import { and, eq } from 'drizzle-orm'
import { exerciseMemberParams } from '#shared/schemas/scenarios'
import { assertFacilitatorRemains } from '~~/server/library'
import { dropMemberSockets } from '~~/server/live'

// The facilitator removes a member; the last facilitator cannot be removed.
export default defineEventHandler(async (event) => {
  const { params: { id, userId }, user } = await requireExerciseAccess(event, 'members.manage', exerciseMemberParams)
  const where = and(eq(schema.memberships.exerciseId, id), eq(schema.memberships.userId, userId))
  const current = useDB().select().from(schema.memberships).where(where).get()
  if (!current) throw createError({ statusCode: 404, message: 'No such member.' })
  if (current.role === 'facilitator') assertFacilitatorRemains(id, userId)
  useDB().delete(schema.memberships).where(where).run()
  audit(user.id, 'exercise.member.remove', id, { userId })
  dropMemberSockets(id, userId, 'removed')
  setResponseStatus(event, 204)
  return null
})
