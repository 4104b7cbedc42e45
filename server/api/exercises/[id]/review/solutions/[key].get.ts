import { solutionReviewParamsSchema } from '#shared/schemas/review'
import { publishedSolution } from '~~/server/review'

// A published solution with its stored assessment, for the replay's hazard brief.
export default defineEventHandler(async (event) => {
  const { params: { id, key } } = await requireExerciseAccess(event, 'review.read', solutionReviewParamsSchema)
  return publishedSolution(id, key)
})
