import { idParamSchema } from '#shared/schemas/auth'
import { downloadHeaders, fileStem, requireReviewer } from '~~/server/review'

// The after-action report as PDF (analyst and facilitator; admins look in).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewer(event, id)
  const data = await reportData(id, { map: true, mapFont: 'Plex' })
  const pdf = await reportPdf(data)
  downloadHeaders(event, 'application/pdf', `${fileStem(data.exercise.title)}-after-action-report.pdf`)
  return pdf
})
