import { eq } from 'drizzle-orm'
import { idParamSchema } from '#shared/schemas/auth'
import { getScenarioRow } from '~~/server/library'

// Removes a scenario from the library; exercises started from it keep their frozen copy.
export default defineEventHandler(async (event) => {
  const user = await requireAuthor(event)
  const { id } = paramsValid(event, idParamSchema)
  const row = getScenarioRow(id)
  useDB().delete(schema.scenarios).where(eq(schema.scenarios.id, id)).run()
  audit(user.id, 'scenario.delete', id, { key: row.key, title: row.title })
  setResponseStatus(event, 204)
  return null
})
