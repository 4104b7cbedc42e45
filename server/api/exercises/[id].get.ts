import { eq } from 'drizzle-orm'
import { getExercise } from '~~/server/library'

// One exercise with its members and teams. The frozen scenario itself is not sent here: players
// must never see expected actions, and each desk reads only what its role may.
export default defineEventHandler(async (event) => {
  const { params: { id }, membership, standing, user } = await requireExerciseAccess(event, 'exercise.read')
  const { scenario, ...exercise } = getExercise(id)
  const canManage = hasCapability(standing, 'members.manage')
  const members = useDB().select({
    userId: schema.users.id, name: schema.users.name, email: schema.users.email,
    role: schema.memberships.role, teamKey: schema.memberships.teamKey,
  }).from(schema.memberships).innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.exerciseId, id)).orderBy(schema.users.name).all()
    .map(m => (canManage ? m : { ...m, email: undefined }))
  const attachments = canManage
    ? useDB().select({
        id: schema.exerciseAttachments.id,
        path: schema.exerciseAttachments.path,
        name: schema.exerciseAttachments.name,
        contentType: schema.exerciseAttachments.contentType,
        size: schema.exerciseAttachments.size,
      })
        .from(schema.exerciseAttachments).where(eq(schema.exerciseAttachments.exerciseId, id)).all()
    : []
  return {
    exercise, attachments,
    scenario: scenario
      ? {
          key: scenario.key,
          title: scenario.title,
          summary: scenario.summary,
          teams: scenario.teams,
          clock: scenario.clock,
        }
      : null,
    membership, members, canManage, can: capabilityFlags(standing), viewer: sessionUser(user),
  }
})
