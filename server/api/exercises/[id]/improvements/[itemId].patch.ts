import { improvementParamsSchema, improvementPatchSchema } from '#shared/schemas/review'
import { updateImprovement } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id, itemId }, user } = await requireExerciseAccess(event, 'review.write', improvementParamsSchema)
  const patch = await readValid(event, improvementPatchSchema)
  return updateImprovement(id, itemId, patch, user.id)
})
