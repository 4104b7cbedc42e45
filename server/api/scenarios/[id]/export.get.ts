import { idParamSchema } from '#shared/schemas/auth'
import { stringifyScenario } from '#shared/scenario'
import { getScenarioRow } from '~~/server/library'

// The scenario as a YAML file (the same format the import reads).
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  downloadHeaders(event, 'application/yaml; charset=utf-8', `${row.key}.yaml`)
  return stringifyScenario(row.document)
})
