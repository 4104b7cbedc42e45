import { messageSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { sendMessage } from '~~/server/live'

// The facilitator sends an ad-hoc message to some teams; the same idempotency key sends it once.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.control')
  const input = await readValid(event, messageSchema)
  const { event: sent, created } = sendMessage(exerciseId, input, user.id)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(sent, view) }
})
