import { idParamSchema } from '#shared/schemas/auth'
import { requireReviewReader, reviewScoring } from '~~/server/review'

// Evaluators' ratings by objective and capability, observations, Cohen's kappa per pair of evaluators and their disagreements.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return reviewScoring(id)
})
