import { improvementParamsSchema } from '#shared/schemas/review'
import { deleteImprovement } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id, itemId }, user } = await requireExerciseAccess(event, 'review.write', improvementParamsSchema)
  deleteImprovement(id, itemId, user.id)
  setResponseStatus(event, 204)
  return null
})
