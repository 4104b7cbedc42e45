import { idParamSchema } from '#shared/schemas/auth'
import { saveScenarioSchema } from '#shared/schemas/scenarios'
import { getScenarioRow, saveScenario, summarise } from '~~/server/library'

// Saves the editor's document: validated whole (400 with a path per problem), revision-checked (409).
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const { revision, document } = await readValid(event, saveScenarioSchema)
  const row = saveScenario(getScenarioRow(id), document, revision, user)
  return { ...summarise(row), document: row.document }
})
