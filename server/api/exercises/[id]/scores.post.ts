import { scoreSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { recordScore } from '~~/server/live'

// An evaluator (or the facilitator) rates a critical task P, S, M or U.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.evaluate')
  const input = await readValid(event, scoreSchema)
  const { event: written, created } = recordScore(exerciseId, user, input)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(written, view) }
})
