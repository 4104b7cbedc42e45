import { feedbackRequestSchema } from '#shared/schemas/review'
import { requestFeedback } from '~~/server/review'

// E-mails the feedback form to chosen members (or all but the sender) once the drill has ended.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'review.write')
  const input = await readValid(event, feedbackRequestSchema)
  return requestFeedback(id, input, user)
})
