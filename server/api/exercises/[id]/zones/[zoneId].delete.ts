import { zoneParamsSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { withdrawZone } from '~~/server/live'

// The team that drew a zone, or control, withdraws it (it stays in the record, marked withdrawn).
export default defineEventHandler(async (event) => {
  const { exerciseId, view, params, ...access } = await requireExerciseAccess(event, 'live.follow', zoneParamsSchema)
  const author = zoneAuthor(access)
  const { event: withdrawn } = withdrawZone(exerciseId, author, params.zoneId)
  return { event: sanitise(withdrawn, view) }
})
