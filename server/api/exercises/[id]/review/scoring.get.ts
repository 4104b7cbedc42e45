import { reviewScoring } from '~~/server/review'

// Evaluators' ratings by objective and capability, observations, Cohen's kappa per pair of evaluators and their disagreements.
export default defineEventHandler(async (event) => {
  const { params: { id }, view } = await requireExerciseAccess(event, 'review.read')
  return reviewScoring(id, view)
})
