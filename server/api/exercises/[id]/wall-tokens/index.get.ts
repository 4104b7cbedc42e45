import { listWallTokens, requireLiveRole } from '~~/server/live'

// The facilitator's wall links (without their tokens).
export default defineEventHandler(async (event) => {
  const { exerciseId } = await requireLiveRole(event, ['facilitator'])
  return listWallTokens(exerciseId)
})
