import { listMemberships } from '~~/server/library'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return { user: sessionUser(user), memberships: listMemberships(user.id) }
})
