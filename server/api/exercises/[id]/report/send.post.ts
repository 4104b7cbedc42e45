import { reportSendSchema } from '#shared/schemas/review'
import { sendReport } from '~~/server/review'

// Sends the after-action report (PDF attached) to chosen members of the exercise.
export default defineEventHandler(async (event) => {
  const { params: { id }, user } = await requireExerciseAccess(event, 'review.write')
  const input = await readValid(event, reportSendSchema)
  return sendReport(id, input, user)
})
