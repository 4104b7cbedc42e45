import { and, eq } from 'drizzle-orm'
import { attachmentParams } from '#shared/schemas/scenarios'
import { sendAttachment } from '~~/server/library'

// An attachment of the exercise's frozen scenario, for the exercise's members only.
export default defineEventHandler(async (event) => {
  const { params: { id, attachmentId } } = await requireExerciseAccess(event, 'exercise.read', attachmentParams)
  const a = useDB().select().from(schema.exerciseAttachments)
    .where(and(eq(schema.exerciseAttachments.id, attachmentId), eq(schema.exerciseAttachments.exerciseId, id))).get()
  if (!a) throw createError({ statusCode: 404, message: 'No such attachment.' })
  return sendAttachment(event, a)
})
