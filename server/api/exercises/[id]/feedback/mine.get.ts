import { myFeedback } from '~~/server/review'

// The feedback form for the signed-in member: questions and their earlier answers.
export default defineEventHandler(async (event) => {
  const { params: { id }, membership, user } = await requireExerciseAccess(event, 'feedback.give')
  return { ...myFeedback(id, user.id), role: membership?.role ?? null }
})
