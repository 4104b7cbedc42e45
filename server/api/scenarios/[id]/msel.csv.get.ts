import { idParamSchema } from '#shared/schemas/auth'
import { getScenarioRow, mselCsv } from '~~/server/library'

// The scenario's injects as CSV (UTF-8 with a byte order mark), one row per inject (the import reads it back).
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  downloadHeaders(event, 'text/csv; charset=utf-8', `${row.key}-injects.csv`)
  return mselCsv(row)
})
