import { and, eq } from 'drizzle-orm'
import { exerciseMemberParams, memberPatchSchema } from '#shared/schemas/scenarios'
import { assertFacilitatorRemains, checkTeam, getExercise } from '~~/server/library'
import { dropMemberSockets } from '~~/server/live'

// The facilitator changes a member's role or team.
export default defineEventHandler(async (event) => {
  const { params: { id, userId }, user } = await requireExerciseAccess(event, 'members.manage', exerciseMemberParams)
  const input = await readValid(event, memberPatchSchema)
  const teamKey = checkTeam(getExercise(id), input.role, input.teamKey)
  const where = and(eq(schema.memberships.exerciseId, id), eq(schema.memberships.userId, userId))
  const current = useDB().select().from(schema.memberships).where(where).get()
  if (!current) throw createError({ statusCode: 404, message: 'No such member.' })
  if (current.role === 'facilitator' && input.role !== 'facilitator') assertFacilitatorRemains(id, userId)
  useDB().update(schema.memberships).set({ role: input.role, teamKey }).where(where).run()
  audit(user.id, 'exercise.member.change', id, { userId, role: input.role, teamKey })
  if (current.role !== input.role || current.teamKey !== teamKey) dropMemberSockets(id, userId, 'changed')
  return { userId, role: input.role, teamKey }
})
