import { reviewFeedback } from '~~/server/review'

// Feedback collected into the review: the summary by role and team, and who was asked and who answered.
export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.read')
  return reviewFeedback(id)
})
