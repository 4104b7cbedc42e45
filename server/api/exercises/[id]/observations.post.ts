import { observationSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { recordObservation } from '~~/server/live'

// An evaluator (or the facilitator) writes a timestamped observation.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, view } = await requireExerciseAccess(event, 'live.evaluate')
  const input = await readValid(event, observationSchema)
  const { event: written, created } = recordObservation(exerciseId, user, input)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(written, view) }
})
