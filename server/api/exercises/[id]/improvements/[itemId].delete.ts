import { improvementParamsSchema } from '#shared/schemas/review'
import { deleteImprovement, requireReviewWriter } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, itemId } = paramsValid(event, improvementParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  deleteImprovement(id, itemId, user.id)
  setResponseStatus(event, 204)
  return null
})
