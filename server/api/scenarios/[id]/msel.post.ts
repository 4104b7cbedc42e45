import { idParamSchema } from '#shared/schemas/auth'
import { mselImportQuerySchema } from '#shared/schemas/scenarios'
import { getScenarioRow, importMsel, MAX_MSEL_BYTES, readUpload, summarise } from '~~/server/library'

// Upload of an inject list (multipart field "file", .xlsx or .csv): replaces the scenario's injects through the editor's
// save. A problem in any row is a 400 with `data.errors: [{ row, column, cell, message }]` and nothing is stored.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const { revision } = queryValid(event, mselImportQuerySchema)
  const row = getScenarioRow(id)
  const file = await readUpload(event, MAX_MSEL_BYTES, 'inject list')
  const saved = await importMsel(row, file.data, revision, user)
  return { ...summarise(saved), document: saved.document }
})
