import { createScenarioSchema } from '#shared/schemas/scenarios'
import { blankScenario, freeKey, insertScenario, keyTaken, summarise } from '~~/server/library'

// A new scenario from the blank template, ready to edit.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { title, key } = await readValid(event, createScenarioSchema)
  const slug = key ?? (title.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 50) || 'scenario')
  if (key && keyTaken(key)) throw createError({
    statusCode: 409,
    message: 'That key is taken.',
    data: { issues: [{ path: 'key', message: `another scenario already has the key "${key}"` }] },
  })
  const row = insertScenario(blankScenario(title, key ?? freeKey(slug)), 'editor', user.id)
  audit(user.id, 'scenario.create', row.id, { key: row.key })
  setResponseStatus(event, 201)
  return summarise(row)
})
