import { and, eq } from 'drizzle-orm'
import { idParamSchema } from '#shared/schemas/auth'
import {
  ALLOWED_ATTACHMENTS,
  getScenarioRow,
  MAX_ATTACHMENT_BYTES,
  putBlob,
  readUpload,
  safeFileName,
  sniffContentType,
} from '~~/server/library'

// Upload of an inject attachment (multipart, field "file"): type sniffed from the bytes, size-limited.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  const file = await readUpload(event, MAX_ATTACHMENT_BYTES, 'attachment')
  const name = safeFileName(file.filename)
  const contentType = sniffContentType(file.data, name)
  if (!contentType) {
    throw createError({
      statusCode: 415,
      message: `This type of file is not accepted. Attach a ${ALLOWED_ATTACHMENTS} file.`,
      data: { issues: [{ path: 'file', message: `not a ${ALLOWED_ATTACHMENTS} file` }] },
    })
  }
  const sha256 = await putBlob(file.data)
  const path = `attachments/${row.key}/${name}`
  const db = useDB()
  const where = and(eq(schema.scenarioAttachments.scenarioId, id), eq(schema.scenarioAttachments.path, path))
  const values = { name: file.filename.slice(0, 200), contentType, size: file.data.length, sha256 }
  const saved = db.select().from(schema.scenarioAttachments).where(where).get()
    ? db.update(schema.scenarioAttachments).set(values).where(where).returning().get()
    : db.insert(schema.scenarioAttachments).values({ scenarioId: id, path, ...values }).returning().get()
  audit(user.id, 'scenario.attachment', id, { path, size: values.size, contentType })
  setResponseStatus(event, 201)
  return { id: saved.id, path: saved.path, name: saved.name, contentType, size: saved.size }
})
