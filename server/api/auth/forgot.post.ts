import { eq } from 'drizzle-orm'
import { forgotSchema } from '#shared/schemas/auth'

// Always the same answer, in the same time, so the form does not reveal which addresses have accounts: the mail goes
// out after the answer. Requests over the limits (per address and per account) send nothing.
export default defineEventHandler(async (event) => {
  const { email } = await readValid(event, forgotSchema)
  const allowed = await resetAllowed(event, email)
  const user = allowed ? useDB().select().from(schema.users).where(eq(schema.users.email, email)).get() : undefined
  if (user && !user.disabled) {
    const token = issueAccountToken(user.id, 'reset')
    queueMail({
      to: user.email,
      subject: 'Brinkwater: reset your password',
      text: `Someone asked to reset the password of your Brinkwater account.\n\nSet a new password (the link works once, for one hour):\n${appLink(`/password/${token}`)}\n\nIf it was not you, ignore this message.`,
    })
  }
  setResponseStatus(event, 202)
  return { ok: true }
})
