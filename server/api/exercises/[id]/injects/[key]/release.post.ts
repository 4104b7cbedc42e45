import { injectParamsSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { releaseInject } from '~~/server/live'

// The facilitator releases an inject now (early, held or contingency); once only, again → 409.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.control')
  const { key } = paramsValid(event, injectParamsSchema)
  const released = releaseInject(exerciseId, key, { actorId: user.id, manual: true })
  setResponseStatus(event, 201)
  return { event: sanitise(released, view) }
})
