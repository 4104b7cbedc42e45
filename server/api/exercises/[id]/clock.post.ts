import { clockActionSchema } from '#shared/schemas/live'
import { changeClock, runDue } from '~~/server/live'

// The facilitator runs the clock: start, pause, resume, speed { factor }, jump { to | toNextInject, due }, end.
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireExerciseAccess(event, 'live.control')
  const input = await readValid(event, clockActionSchema)
  const result = changeClock(exerciseId, input, user.id)
  // A jump releases at once what fell due on the way, deadlines moved by as much as they came late (with
  // `due: skip` the jump has held them instead).
  if (input.action === 'jump') await runDue(exerciseId)
  return result
})
