import { listMemberships } from '~~/server/library'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return listMemberships(user.id).map(m => ({ ...m, home: roleHome(m.exerciseId, m.role) }))
})
