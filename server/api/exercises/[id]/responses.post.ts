import { responseSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { submitResponse } from '~~/server/live'

// A player answers an inject released to their team; the same idempotency key answers once.
export default defineEventHandler(async (event) => {
  const { exerciseId, user, membership, view } = await requireExerciseAccess(event, 'live.respond')
  const input = await readValid(event, responseSchema)
  const { event: written, created } = submitResponse(exerciseId, user, membership!, input)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(written, view) }
})
