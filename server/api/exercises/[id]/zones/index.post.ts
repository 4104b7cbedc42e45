import { zoneSchema } from '#shared/schemas/live'
import { sanitise } from '#shared/live/visibility'
import { drawZone } from '~~/server/live'

// A team draws a protective-action zone on its hazard map (control may too, for the agencies it plays). Every team,
// the staff and the wall see it; the same idempotency key draws it once.
export default defineEventHandler(async (event) => {
  const { exerciseId, view, ...access } = await requireExerciseAccess(event, 'live.follow')
  const author = zoneAuthor(access)
  const input = await readValid(event, zoneSchema)
  const { event: drawn, created } = drawZone(exerciseId, author, input)
  setResponseStatus(event, created ? 201 : 200)
  return { event: sanitise(drawn, view) }
})
