import { messageSchema, teamMessageSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { hasCapability } from '#shared/utils/permissions'
import { sendMessage, sendTeamMessage } from '~~/server/live'

// Messages in the drill. The facilitator sends an ad-hoc message to some teams; a player writes from their team to
// control, or to another team through control. The same idempotency key sends once.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view, standing, membership } = await requireExerciseAccess(event, 'live.follow')
  if (hasCapability(standing, 'live.control')) {
    const input = await readValid(event, messageSchema)
    const { event: sent, created } = sendMessage(exerciseId, input, user.id)
    setResponseStatus(event, created ? 201 : 200)
    return { event: sanitise(sent, view) }
  }
  // An admin looking in writes nothing (as on every write route: no such exercise for them); other roles may not.
  if (standing === 'admin-visitor' || !membership) throw notFound('No such exercise.')
  if (!hasCapability(standing, 'live.respond')) throw forbidden('Your role in this exercise does not allow this.')
  const input = await readValid(event, teamMessageSchema)
  const { event: sent, created } = sendTeamMessage(exerciseId, user, membership, input)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(sent, view) }
})
