import { previewSchema } from '#shared/schemas/scenarios'
import { runTask } from '~~/server/workers/pool'

// The editor's live preview: the hazard assessment of one (unsaved) orbit solution, computed on a worker thread.
export default defineEventHandler(async (event) => {
  await requireAuthor(event)
  const { solution, sites, samples, seed } = await readValid(event, previewSchema)
  return runTask('assess', { solution, sites, samples, seed })
})
