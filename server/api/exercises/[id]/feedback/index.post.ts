import { idParamSchema } from '#shared/schemas/auth'
import { feedbackSchema } from '#shared/schemas/review'
import { submitFeedback } from '~~/server/review'

// Any member sends (or replaces) their own feedback on the drill.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireExerciseRole(event, id, ALL_EXERCISE_ROLES)
  const input = await readValid(event, feedbackSchema)
  return submitFeedback(id, user.id, input)
})
