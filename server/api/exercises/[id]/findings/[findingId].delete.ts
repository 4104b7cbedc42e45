import { findingParamsSchema } from '#shared/schemas/review'
import { deleteFinding, requireReviewWriter } from '~~/server/review'

// Deleting an area for improvement keeps its corrective actions in the plan (unlinked).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, findingId } = paramsValid(event, findingParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  deleteFinding(id, findingId, user.id)
  setResponseStatus(event, 204)
  return null
})
