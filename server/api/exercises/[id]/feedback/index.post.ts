import { feedbackSchema } from '#shared/schemas/review'
import { submitFeedback } from '~~/server/review'

// Any member sends (or replaces) their own feedback on the drill.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'feedback.give')
  const input = await readValid(event, feedbackSchema)
  return submitFeedback(id, user.id, input)
})
