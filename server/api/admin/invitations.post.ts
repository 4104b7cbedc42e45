import { eq } from 'drizzle-orm'
import { inviteSchema } from '#shared/schemas/auth'

// Invites a person by e-mail: creates the account without a password and mails a single-use link.
export default defineEventHandler(async (event) => {
  const admin = await requireAdmin(event)
  const input = await readValid(event, inviteSchema)
  const db = useDB()
  const existing = db.select().from(schema.users).where(eq(schema.users.email, input.email)).get()
  if (existing?.passwordHash) throw createError({
    statusCode: 409,
    message: 'This person already has an account.',
    data: { issues: [{ path: 'email', message: 'Already has an account.' }] },
  })
  const user = existing ?? db.insert(schema.users).values({
    email: input.email,
    name: input.name,
    systemRole: input.systemRole,
  }).returning().get()
  const token = issueAccountToken(user.id, 'invite')
  await sendMail({
    to: user.email,
    subject: 'You are invited to Brinkwater',
    text: `${admin.name} invited you to Brinkwater, where planetary-defense drills are run.\n\nChoose your password (the link works once, for 72 hours):\n${appLink(`/password/${token}?welcome=1`)}\n`,
  })
  audit(admin.id, 'user.invite', user.id, { email: user.email, systemRole: user.systemRole })
  setResponseStatus(event, 201)
  return { id: user.id, email: user.email }
})
