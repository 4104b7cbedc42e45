import { findingParamsSchema } from '#shared/schemas/review'
import { deleteFinding } from '~~/server/review'

// Deleting an area for improvement keeps its corrective actions in the plan (unlinked).
export default defineEventHandler(async (event) => {
  const { params: { id, findingId }, user } = await requireExerciseAccess(event, 'review.write', findingParamsSchema)
  deleteFinding(id, findingId, user.id)
  setResponseStatus(event, 204)
  return null
})
