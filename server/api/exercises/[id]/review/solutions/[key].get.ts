import { solutionReviewParamsSchema } from '#shared/schemas/review'
import { publishedSolution, requireReviewReader } from '~~/server/review'

// A published solution with its stored assessment, for the replay's hazard brief.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, key } = paramsValid(event, solutionReviewParamsSchema)
  await requireReviewReader(event, id)
  return publishedSolution(id, key)
})
