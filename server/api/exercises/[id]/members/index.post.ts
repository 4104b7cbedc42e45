import { and, eq } from 'drizzle-orm'
import { memberSchema } from '#shared/schemas/scenarios'
import { checkTeam, getExercise } from '~~/server/library'

// The facilitator adds a person (who already has an account) by e-mail, with a role and team.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'members.manage')
  const input = await readValid(event, memberSchema)
  const exercise = getExercise(id)
  const teamKey = checkTeam(exercise, input.role, input.teamKey)
  const db = useDB()
  const person = db.select().from(schema.users).where(eq(schema.users.email, input.email)).get()
  if (!person || person.disabled) {
    throw createError({
      statusCode: 404,
      message: 'No active account has this e-mail. Ask an administrator to invite the person first.',
      data: { issues: [{ path: 'email', message: 'no account with this e-mail' }] },
    })
  }
  if (db.select().from(schema.memberships).where(and(
    eq(schema.memberships.exerciseId, id),
    eq(schema.memberships.userId, person.id),
  )).get()) {
    throw createError({
      statusCode: 409,
      message: 'This person is already a member; change their role instead.',
      data: { issues: [{ path: 'email', message: 'already a member' }] },
    })
  }
  db.insert(schema.memberships).values({ exerciseId: id, userId: person.id, role: input.role, teamKey }).run()
  audit(user.id, 'exercise.member.add', id, { userId: person.id, role: input.role, teamKey })
  setResponseStatus(event, 201)
  return { userId: person.id, name: person.name, role: input.role, teamKey }
})
