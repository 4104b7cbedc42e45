import { idParamSchema } from '#shared/schemas/auth'
import { downloadHeaders, exerciseTimeline, fileStem, requireReviewer, timelineXlsx } from '~~/server/review'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = paramsValid(event, idParamSchema)
  await requireReviewer(event, id)
  const { exercise, rows } = exerciseTimeline(id)
  downloadHeaders(event, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', `${fileStem(exercise.title)}-timeline.xlsx`)
  return timelineXlsx(exercise.title, rows)
})
