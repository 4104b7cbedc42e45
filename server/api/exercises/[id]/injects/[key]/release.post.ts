import { injectParamsSchema, releaseSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { releaseInject } from '~~/server/live'

// The facilitator releases an inject now (early, held or contingency); once only, again → 409. Figures without a
// published solution → 409 no-solution, unless { force: true }.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.control')
  const { key } = paramsValid(event, injectParamsSchema)
  const { force } = await readValid(event, releaseSchema)
  const released = releaseInject(exerciseId, key, { actorId: user.id, manual: true, force })
  setResponseStatus(event, 201)
  return { event: sanitise(released, view) }
})
