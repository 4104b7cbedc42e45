import { idParamSchema } from '#shared/schemas/auth'
import { requireReviewReader, reviewOverview } from '~~/server/review'

// The review desk frame: exercise, scenario parts, members, the whole timeline with filter facets, permissions.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const access = await requireReviewReader(event, id)
  return reviewOverview(id, access)
})
