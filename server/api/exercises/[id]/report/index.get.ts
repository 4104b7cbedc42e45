import { reportData } from '~~/server/review'
// The after-action report's content for the printable page (the PDF is drawn from the same data).
export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  return reportData(id, { map: true })
})
