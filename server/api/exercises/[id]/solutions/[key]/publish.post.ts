import { solutionParamsSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { publishSolution } from '~~/server/live'

// The facilitator publishes an orbit solution now (the scheduler does at its release time); once only.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.control')
  const { key } = paramsValid(event, solutionParamsSchema)
  const published = await publishSolution(exerciseId, key, { actorId: user.id, manual: true })
  setResponseStatus(event, 201)
  return { event: sanitise(published, view) }
})
