import { idParamSchema } from '#shared/schemas/auth'
import { downloadHeaders, exerciseTimeline, fileStem, requireReviewer, timelineCsv } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewer(event, id)
  const { exercise, rows } = exerciseTimeline(id)
  downloadHeaders(event, 'text/csv; charset=utf-8', `${fileStem(exercise.title)}-timeline.csv`)
  return `\uFEFF${timelineCsv(exercise.title, rows)}`
})
