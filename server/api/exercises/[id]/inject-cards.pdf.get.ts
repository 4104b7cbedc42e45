import { idParamSchema } from '#shared/schemas/auth'
import { getExercise } from '~~/server/library'
import { downloadHeaders, fileStem, requireReviewer } from '~~/server/review'

// Printable inject cards, one page per inject of the frozen scenario (no expected actions).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewer(event, id)
  const exercise = getExercise(id)
  const pdf = await injectCardsPdf(id)
  downloadHeaders(event, 'application/pdf', `${fileStem(exercise.title)}-inject-cards.pdf`)
  return pdf
})
