import { wallTokenSchema } from '#shared/schemas/live'
import { createWallToken, liveExercise } from '~~/server/live'

// The facilitator makes a share link for the wall view; the token is shown this once.
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireExerciseAccess(event, 'live.control')
  const { label } = await readValid(event, wallTokenSchema)
  liveExercise(useDB(), exerciseId)
  setResponseStatus(event, 201)
  return createWallToken(exerciseId, label, user.id)
})
