import { eq } from 'drizzle-orm'
import { idParamSchema } from '../../../shared/schemas/auth'

// One exercise with its members; every member may see who takes part.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const { membership } = await requireExerciseRole(event, id, ALL_EXERCISE_ROLES, { allowAdmin: true })
  const exercise = useDB().select().from(schema.exercises).where(eq(schema.exercises.id, id)).get()!
  const members = useDB().select({
    userId: schema.users.id, name: schema.users.name, role: schema.memberships.role, teamKey: schema.memberships.teamKey,
  }).from(schema.memberships).innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.exerciseId, id)).all()
  return { exercise, membership, members, viewer: sessionUser(user) }
})
