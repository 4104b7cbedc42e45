import { idParamSchema } from '#shared/schemas/auth'
import { requireReviewReader, reviewDecisions } from '~~/server/review'

// Decisions with the time each team took to answer (release to first response, against the deadline), per team and per phase.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return reviewDecisions(id)
})
