import { findingParamsSchema, findingPatchSchema } from '#shared/schemas/review'
import { updateFinding } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id, findingId }, user } = await requireExerciseAccess(event, 'review.write', findingParamsSchema)
  const patch = await readValid(event, findingPatchSchema)
  return updateFinding(id, findingId, patch, user.id)
})
