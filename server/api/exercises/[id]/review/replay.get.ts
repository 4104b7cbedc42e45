import { replayRecord } from '~~/server/review'

// The record with audiences for the replay (assessments left out; see review/solutions/[key]).
export default defineEventHandler(async (event) => {
  const { params: { id }, view } = await requireExerciseAccess(event, 'review.read')
  return replayRecord(id, view)
})
