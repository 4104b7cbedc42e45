import { listFindings } from '~~/server/review'

export default defineEventHandler(async (event) => {
  const { params: { id } } = await requireExerciseAccess(event, 'review.read')
  return listFindings(id)
})
