import { idParamSchema } from '#shared/schemas/auth'
import { listFindings, requireReviewReader } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return listFindings(id)
})
