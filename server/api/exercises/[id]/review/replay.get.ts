import { idParamSchema } from '#shared/schemas/auth'
import { replayRecord, requireReviewReader } from '~~/server/review'

// The record with audiences for the replay (assessments left out; see review/solutions/[key]).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewReader(event, id)
  return replayRecord(id)
})
