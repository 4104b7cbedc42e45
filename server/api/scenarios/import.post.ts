import { importQuerySchema } from '#shared/schemas/scenarios'
import { MAX_SCENARIO_BYTES } from '#shared/scenario'
import { importScenario, readUpload, summarise } from '~~/server/library'

// Upload of a scenario file (multipart, field "file"): all of it is stored, or nothing.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { onConflict } = queryValid(event, importQuerySchema)
  const file = await readUpload(event, MAX_SCENARIO_BYTES, 'scenario file')
  let text: string
  try { text = new TextDecoder('utf-8', { fatal: true }).decode(file.data) }
  catch {
    throw createError({
      statusCode: 400,
      message: 'The file is not UTF-8 text.',
      data: { issues: [{ path: '', message: 'not UTF-8 text', line: 1, column: 1 }] },
    })
  }
  const row = importScenario(text, onConflict, user)
  setResponseStatus(event, 201)
  return summarise(row)
})
