import { fileStem, reportPdf } from '~~/server/review'

// The after-action report as PDF (analyst and facilitator; admins look in).
export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  const { data, pdf } = await reportPdf(id)
  downloadHeaders(event, 'application/pdf', `${fileStem(data.exercise.title)}-after-action-report.pdf`)
  return pdf
})
