import { eventsQuerySchema } from '#shared/schemas/live'
import { latestSeq, visibleEvents } from '~~/server/live'

// The event record after `since`, as the caller may see it (the same sanitising as the socket).
export default defineEventHandler(async (event) => {
  const { exerciseId, view } = await requireExerciseAccess(event, 'live.follow')
  const { since, limit } = queryValid(event, eventsQuerySchema)
  const events = visibleEvents(exerciseId, view, since, limit + 1)
  return { events: events.slice(0, limit), more: events.length > limit, lastSeq: latestSeq(exerciseId) }
})
