import { findingParamsSchema, findingPatchSchema } from '#shared/schemas/review'
import { requireReviewWriter, updateFinding } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, findingId } = paramsValid(event, findingParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  const patch = await readValid(event, findingPatchSchema)
  return updateFinding(id, findingId, patch, user.id)
})
