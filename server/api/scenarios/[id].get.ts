import { eq } from 'drizzle-orm'
import { idParamSchema } from '#shared/schemas/auth'
import { getScenarioRow, summarise } from '~~/server/library'

// One scenario with its whole document and attachment list, for the editor.
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  const attachments = useDB().select({
    id: schema.scenarioAttachments.id, path: schema.scenarioAttachments.path, name: schema.scenarioAttachments.name,
    contentType: schema.scenarioAttachments.contentType, size: schema.scenarioAttachments.size,
  }).from(schema.scenarioAttachments).where(eq(schema.scenarioAttachments.scenarioId, id)).all()
  return { ...summarise(row), document: row.document, attachments }
})
