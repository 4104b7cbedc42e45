import { liveSnapshot } from '~~/server/live'

// A desk's snapshot of the live exercise, shaped by the caller's role (see liveSnapshot).
export default defineEventHandler(async (event) => {
  const { exerciseId, view } = await requireExerciseAccess(event, 'live.follow')
  return liveSnapshot(exerciseId, view)
})
