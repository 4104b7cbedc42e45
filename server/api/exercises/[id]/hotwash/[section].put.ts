import { hotwashParamsSchema, hotwashSchema } from '#shared/schemas/review'
import { saveHotwash } from '~~/server/review'

// Saves one hotwash section; a stale revision → 409 with the current text.
export default defineEventHandler(async (event) => {
  const { params: { id, section }, user } = await requireExerciseAccess(event, 'review.write', hotwashParamsSchema)
  const input = await readValid(event, hotwashSchema)
  return saveHotwash(id, section, input, user.id)
})
