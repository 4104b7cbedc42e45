import { eq, sql } from 'drizzle-orm'
import { setPasswordSchema } from '#shared/schemas/auth'

// Completes an invitation or a reset: the token is spent, the password set, the person signed in.
export default defineEventHandler(async (event) => {
  const { token, password } = await readValid(event, setPasswordSchema)
  const { userId } = consumeAccountToken(token)
  const passwordHash = await hashPassword(password)
  // A new password ends every session opened before it (on any device).
  const user = useDB().update(schema.users)
    .set({ passwordHash, sessionGeneration: sql`${schema.users.sessionGeneration} + 1` })
    .where(eq(schema.users.id, userId)).returning().get()
  if (!user || user.disabled) throw createError({ statusCode: 400, message: 'This link is invalid or has expired. Ask for a new one.' })
  await startFreshSession(event, user)
  return { user: sessionUser(user) }
})
