import { exerciseTimeline, fileStem, timelineXlsx } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  const { exercise, rows } = exerciseTimeline(id)
  downloadHeaders(event, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', `${fileStem(exercise.title)}-timeline.xlsx`)
  return timelineXlsx(exercise.title, rows)
})
