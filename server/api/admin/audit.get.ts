import { and, desc, eq, lt } from 'drizzle-orm'
import { z } from 'zod'

const auditQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
  /** Entries before this time (ISO), for the next page. */
  before: z.iso.datetime().optional(),
  action: z.string().regex(/^[\w.-]{1,80}$/).optional(),
})

// The audit trail of administrative actions (invitations, backups, scenario and member changes), newest first.
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const { limit, before, action } = queryValid(event, auditQuerySchema)
  const a = schema.auditLog
  return useDB().select({
    id: a.id, action: a.action, target: a.target, data: a.data, createdAt: a.createdAt,
    actor: { id: schema.users.id, email: schema.users.email, name: schema.users.name },
  }).from(a).leftJoin(schema.users, eq(schema.users.id, a.actorId))
    .where(and(before ? lt(a.createdAt, new Date(before)) : undefined, action ? eq(a.action, action) : undefined))
    .orderBy(desc(a.createdAt)).limit(limit).all()
})
