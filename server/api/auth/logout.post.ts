// Signs out this session for good: its id is revoked (a copy of the cookie opens nothing), then the cookie cleared.
export default defineEventHandler(async (event) => {
  const session = await getUserSession(event)
  if (session.id && session.user) revokeSession(session.id)
  await clearUserSession(event)
  return { ok: true }
})
