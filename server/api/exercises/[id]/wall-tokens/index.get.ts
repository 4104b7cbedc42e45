import { listWallTokens } from '~~/server/live'

// The facilitator's wall links (without their tokens).
export default defineEventHandler(async (event) => {
  const { exerciseId } = await requireExerciseAccess(event, 'live.control')
  return listWallTokens(exerciseId)
})
