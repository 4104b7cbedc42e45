import { desc } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  return useDB().select({
    id: schema.users.id, email: schema.users.email, name: schema.users.name,
    systemRole: schema.users.systemRole, disabled: schema.users.disabled,
    hasPassword: schema.users.passwordHash, createdAt: schema.users.createdAt,
  }).from(schema.users).orderBy(desc(schema.users.createdAt)).all()
    .map(u => ({ ...u, hasPassword: Boolean(u.hasPassword) }))
})
