import { DRILL_CAUTION, DRILL_MARKING } from '#shared/utils/drill'
import { exerciseTimeline, fileStem } from '~~/server/review'

// The record itself (every event with its full payload) plus the readable rows.
export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.export')
  const { exercise, rows, events } = exerciseTimeline(id)
  downloadHeaders(event, 'application/json; charset=utf-8', `${fileStem(exercise.title)}-timeline.json`)
  return {
    marking: DRILL_MARKING, caution: DRILL_CAUTION,
    exercise: { id: exercise.id, title: exercise.title, scenario: exercise.scenario?.key ?? null, exportedAt: new Date().toISOString() },
    rows,
    events: events.map(e => ({ ...e, wallTime: new Date(e.wallTime).toISOString(), scenarioTime: new Date(e.scenarioTime).toISOString() })),
  }
})
