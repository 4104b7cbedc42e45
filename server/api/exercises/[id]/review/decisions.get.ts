import { reviewDecisions } from '~~/server/review'

// Decisions with the time each team took to answer (release to first response, against the deadline), per team and per phase.
export default defineEventHandler(async (event) => {
  const { params: { id }, view } = await requireExerciseAccess(event, 'review.read')
  return reviewDecisions(id, view)
})
