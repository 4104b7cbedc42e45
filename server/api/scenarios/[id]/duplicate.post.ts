import { idParamSchema } from '#shared/schemas/auth'
import { duplicateScenario, getScenarioRow, summarise } from '~~/server/library'

export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const copy = duplicateScenario(getScenarioRow(id), user)
  audit(user.id, 'scenario.duplicate', copy.id, { from: id })
  setResponseStatus(event, 201)
  return summarise(copy)
})
