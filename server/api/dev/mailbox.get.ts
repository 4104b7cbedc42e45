import { desc } from 'drizzle-orm'

// The development mailbox: what the local SMTP catcher caught. Absent when a real relay is set.
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  if (!usingFakeSmtp()) throw createError({ statusCode: 404, message: 'No development mailbox: a real SMTP relay is configured.' })
  return useDB().select().from(schema.caughtMail).orderBy(desc(schema.caughtMail.createdAt)).limit(200).all()
})
