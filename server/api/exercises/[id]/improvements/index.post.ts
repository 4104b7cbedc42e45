import { idParamSchema } from '#shared/schemas/auth'
import { improvementSchema } from '#shared/schemas/review'
import { createImprovement, requireReviewWriter } from '~~/server/review'

// A corrective action of the improvement plan: capability element (POETE), owner, dates and status.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const { user } = await requireReviewWriter(event, id)
  const input = await readValid(event, improvementSchema)
  setResponseStatus(event, 201)
  return createImprovement(id, input, user.id)
})
