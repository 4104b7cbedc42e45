import { idParamSchema } from '#shared/schemas/auth'
import { feedbackRequestSchema } from '#shared/schemas/review'
import { requestFeedback, requireReviewWriter } from '~~/server/review'

// E-mails the feedback form to chosen members (or all but the sender) once the drill has ended.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewWriter(event, id)
  const input = await readValid(event, feedbackRequestSchema)
  return requestFeedback(id, input, user)
})
