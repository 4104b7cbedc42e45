import { reviewOverview } from '~~/server/review'

// The review desk frame: exercise, scenario parts, members, the whole timeline with filter facets, permissions.
export default defineEventHandler(async (event) => {
  const access = await requireExerciseAccess(event, 'review.read')
  const { id } = access.params
  return reviewOverview(id, access)
})
