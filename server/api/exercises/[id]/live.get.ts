import { liveSnapshot, requireLiveRole } from '~~/server/live'

// A desk's snapshot of the live exercise, shaped by the caller's role (see liveSnapshot).
export default defineEventHandler(async (event) => {
  const { exerciseId, view } = await requireLiveRole(event, ALL_EXERCISE_ROLES, { allowAdmin: true })
  return liveSnapshot(exerciseId, view)
})
