import { idParamSchema } from '#shared/schemas/auth'
import { stringifyScenario } from '#shared/scenario'
import { getScenarioRow } from '~~/server/library'

// The scenario as a YAML file (the same format the import reads).
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  setResponseHeaders(event, {
    'Content-Type': 'application/yaml; charset=utf-8',
    'Content-Disposition': `attachment; filename="${row.key}.yaml"`,
    'Cache-Control': 'no-store',
  })
  return stringifyScenario(row.document)
})
