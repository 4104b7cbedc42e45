import { findingParamsSchema, findingPatchSchema } from '../../../../../shared/schemas/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, findingId } = paramsValid(event, findingParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  const patch = await readValid(event, findingPatchSchema)
  return updateFinding(id, findingId, patch, user.id)
})
