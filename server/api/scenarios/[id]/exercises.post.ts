import { idParamSchema } from '#shared/schemas/auth'
import { startExerciseSchema } from '#shared/schemas/scenarios'
import { getScenarioRow, startExercise } from '~~/server/library'

// Starts an exercise from this scenario: a frozen copy, with the caller as its facilitator.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const input = await readValid(event, startExerciseSchema)
  const exercise = startExercise(getScenarioRow(id), input, user)
  setResponseStatus(event, 201)
  return { id: exercise.id, title: exercise.title }
})
