import { assessSolution } from '#shared/hazard'
import { previewSchema } from '#shared/schemas/scenarios'

// The editor's live preview: the hazard assessment of one (unsaved) orbit solution.
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { solution, sites, samples, seed } = await readValid(event, previewSchema)
  return assessSolution(solution, sites, { samples, seed })
})
