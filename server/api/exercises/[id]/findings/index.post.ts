import { findingSchema } from '#shared/schemas/review'
import { createFinding } from '~~/server/review'

// A strength or an area for improvement, tied to an objective and one of its capabilities.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'review.write')
  const input = await readValid(event, findingSchema)
  setResponseStatus(event, 201)
  return createFinding(id, input, user.id)
})
