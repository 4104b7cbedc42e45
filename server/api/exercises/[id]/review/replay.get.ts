import { replayQuerySchema } from '#shared/schemas/live'
import { replayRecord } from '~~/server/review'

// The record with audiences for the replay, a page at a time (assessments left out; see review/solutions/[key]).
export default defineEventHandler(async (event) => {
  const { params: { id }, view } = await requireExerciseAccess(event, 'review.read')
  return replayRecord(id, view, queryValid(event, replayQuerySchema))
})
