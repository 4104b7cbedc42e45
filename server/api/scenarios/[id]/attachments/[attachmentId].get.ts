import { and, eq } from 'drizzle-orm'
import { attachmentParams } from '#shared/schemas/scenarios'
import { sendAttachment } from '~~/server/library'

// An attachment of a library scenario, for its authors.
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { id, attachmentId } = paramsValid(event, attachmentParams)
  const a = useDB().select().from(schema.scenarioAttachments)
    .where(and(eq(schema.scenarioAttachments.id, attachmentId), eq(schema.scenarioAttachments.scenarioId, id))).get()
  if (!a) throw createError({ statusCode: 404, message: 'No such attachment.' })
  return sendAttachment(event, a)
})
