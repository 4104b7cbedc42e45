import { exerciseTimeline, fileStem, timelineCsv } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  const { exercise, rows } = exerciseTimeline(id)
  downloadHeaders(event, 'text/csv; charset=utf-8', `${fileStem(exercise.title)}-timeline.csv`)
  return `\uFEFF${timelineCsv(exercise.title, rows)}`
})
