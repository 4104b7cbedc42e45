import { idParamSchema } from '#shared/schemas/auth'
import { requireReviewReader, reviewFeedback } from '~~/server/review'

// Feedback collected into the review: the summary by role and team, and who was asked and who answered.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return reviewFeedback(id)
})
