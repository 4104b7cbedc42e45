import { listScenarios } from '~~/server/library'

// The scenario library (authors and admins).
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  return listScenarios()
})
