import { hotwashParamsSchema, hotwashSchema } from '#shared/schemas/review'
import { requireReviewWriter, saveHotwash } from '~~/server/review'

// Saves one hotwash section; a stale revision → 409 with the current text.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id, section } = paramsValid(event, hotwashParamsSchema)
  const { user } = await requireReviewWriter(event, id)
  const input = await readValid(event, hotwashSchema)
  return saveHotwash(id, section, input, user.id)
})
