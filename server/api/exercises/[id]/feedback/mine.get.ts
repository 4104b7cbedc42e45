import { idParamSchema } from '#shared/schemas/auth'
import { myFeedback } from '~~/server/review'

// The feedback form for the signed-in member: questions and their earlier answers.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const { membership } = await requireExerciseRole(event, id, ALL_EXERCISE_ROLES)
  return { ...myFeedback(id, user.id), role: membership?.role ?? null }
})
