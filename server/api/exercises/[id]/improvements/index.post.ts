import { improvementSchema } from '#shared/schemas/review'
import { createImprovement } from '~~/server/review'

// A corrective action of the improvement plan: capability element (POETE), owner, dates and status.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'review.write')
  const input = await readValid(event, improvementSchema)
  setResponseStatus(event, 201)
  return createImprovement(id, input, user.id)
})
