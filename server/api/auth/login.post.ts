import { eq } from 'drizzle-orm'
import { loginSchema } from '#shared/schemas/auth'

const BAD_CREDENTIALS = 'E-mail or password not recognised.'
/** Checked against for unknown accounts, so that the answer takes as long whether the account exists or not. */
let dummyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await readValid(event, loginSchema)
  await consumeLoginAttempt(event, email)
  const user = useDB().select().from(schema.users).where(eq(schema.users.email, email)).get()
  const hash = user?.passwordHash || await (dummyHash ??= hashPassword('no account has this password'))
  const matches = await verifyPassword(hash, password)
  const ok = !!user?.passwordHash && !user.disabled && matches
  if (!user || !ok) throw createError({ statusCode: 401, message: BAD_CREDENTIALS })
  await recordLoginSuccess(event, email)
  await startFreshSession(event, user)
  return { user: sessionUser(user) }
})
