import { idParamSchema } from '#shared/schemas/auth'
import { reportSendSchema } from '#shared/schemas/review'
import { requireReviewWriter } from '~~/server/review'

// Sends the after-action report (PDF attached) to chosen members of the exercise.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewWriter(event, id)
  const input = await readValid(event, reportSendSchema)
  return sendReport(id, input, user)
})
