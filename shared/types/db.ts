import type { accountTokens, auditLog, exercises, memberships, users } from '../../server/db/schema'

export type User = typeof users.$inferSelect
export type NewUser = typeof users.$inferInsert
export type Exercise = typeof exercises.$inferSelect
export type NewExercise = typeof exercises.$inferInsert
export type Membership = typeof memberships.$inferSelect
export type NewMembership = typeof memberships.$inferInsert
export type AccountToken = typeof accountTokens.$inferSelect
export type AuditEntry = typeof auditLog.$inferSelect
