import { clockActionSchema } from '#shared/schemas/live'
import { changeClock, runDue } from '~~/server/live'

// The facilitator runs the clock: start, pause, resume, speed { factor }, jump { to | toNextInject }, end.
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireExerciseAccess(event, 'live.control')
  const input = await readValid(event, clockActionSchema)
  const result = changeClock(exerciseId, input, user.id)
  // A jump releases at once what fell due on the way.
  if (input.action === 'jump') await runDue(exerciseId)
  return result
})
