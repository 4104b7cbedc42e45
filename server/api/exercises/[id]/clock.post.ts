import { clockActionSchema } from '../../../../shared/schemas/live'

// The facilitator runs the clock: start, pause, resume, speed { factor }, jump { to | toNextInject }, end.
export default defineEventHandler(async (event) => {
  const { exerciseId, user } = await requireLiveRole(event, ['facilitator'])
  const input = await readValid(event, clockActionSchema)
  return changeClock(exerciseId, input, user.id)
})
