import { idParamSchema } from '#shared/schemas/auth'
import { findingSchema } from '#shared/schemas/review'
import { createFinding, requireReviewWriter } from '~~/server/review'

// A strength or an area for improvement, tied to an objective and one of its capabilities.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  const { user } = await requireReviewWriter(event, id)
  const input = await readValid(event, findingSchema)
  setResponseStatus(event, 201)
  return createFinding(id, input, user.id)
})
