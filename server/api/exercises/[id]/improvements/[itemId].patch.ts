import { improvementParamsSchema, improvementPatchSchema } from '#shared/schemas/review'
import { requireReviewWriter, updateImprovement } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, itemId } = paramsValid(event, improvementParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  const patch = await readValid(event, improvementPatchSchema)
  return updateImprovement(id, itemId, patch, user.id)
})
