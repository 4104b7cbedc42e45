import { idParamSchema } from '#shared/schemas/auth'
import { getScenarioRow, mselXlsx } from '~~/server/library'

// The scenario's injects as an XLSX workbook, one row per inject (the import reads it back).
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  downloadHeaders(event, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', `${row.key}-injects.xlsx`)
  return await mselXlsx(row)
})
