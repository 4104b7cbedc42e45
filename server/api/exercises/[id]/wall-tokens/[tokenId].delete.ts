import { wallTokenParamsSchema } from '#shared/schemas/live'
import { revokeWallToken } from '~~/server/live'

// The facilitator revokes a wall link; walls using it are disconnected.
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireExerciseAccess(event, 'live.control')
  const { tokenId } = paramsValid(event, wallTokenParamsSchema)
  revokeWallToken(exerciseId, tokenId, user.id)
  setResponseStatus(event, 204)
  return null
})
