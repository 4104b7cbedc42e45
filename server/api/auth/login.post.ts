import { eq } from 'drizzle-orm'
import { loginSchema } from '#shared/schemas/auth'

const BAD_CREDENTIALS = 'E-mail or password not recognised.'

export default defineEventHandler(async (event) => {
  const { email, password } = await readValid(event, loginSchema)
  await assertLoginAllowed(event, email)
  const user = useDB().select().from(schema.users).where(eq(schema.users.email, email)).get()
  const ok = user?.passwordHash && !user.disabled && await verifyPassword(user.passwordHash, password)
  if (!user || !ok) {
    await recordLoginFailure(event, email)
    throw createError({ statusCode: 401, message: BAD_CREDENTIALS })
  }
  await recordLoginSuccess(event, email)
  await startFreshSession(event, user)
  return { user: sessionUser(user) }
})
