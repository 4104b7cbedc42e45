import { injectParamsSchema } from '#shared/schemas/live'
import { holdInject } from '~~/server/live'

// The facilitator holds an inject so the scheduler skips it (release it by hand later).
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireExerciseAccess(event, 'live.control')
  const { key } = paramsValid(event, injectParamsSchema)
  const { created } = holdInject(exerciseId, key, user.id)
  setResponseStatus(event, created ? 201 : 200)
  return { key, status: 'held' as const }
})
