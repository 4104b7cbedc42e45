import { getExercise } from '~~/server/library'
import { fileStem, injectCardsPdf } from '~~/server/review'

// Printable inject cards, one page per inject of the frozen scenario (no expected actions).
export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  const exercise = getExercise(id)
  const pdf = await injectCardsPdf(id)
  downloadHeaders(event, 'application/pdf', `${fileStem(exercise.title)}-inject-cards.pdf`)
  return pdf
})
