import { idParamSchema } from '#shared/schemas/auth'
import { hotwashNotes, requireReviewReader } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return hotwashNotes(id)
})
