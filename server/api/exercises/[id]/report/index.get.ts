import { idParamSchema } from '#shared/schemas/auth'
import { requireReviewer } from '~~/server/review'

// The after-action report's content for the printable page (the PDF is drawn from the same data).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewer(event, id)
  return reportData(id, { map: true })
})
