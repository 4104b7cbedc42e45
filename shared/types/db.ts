import type {
  accountTokens,
  auditLog,
  exerciseAttachments,
  exercises,
  memberships,
  scenarioAttachments,
  scenarios,
  users,
} from '../../server/db/schema'

export type User = typeof users.$inferSelect
export type NewUser = typeof users.$inferInsert
export type Exercise = typeof exercises.$inferSelect
export type NewExercise = typeof exercises.$inferInsert
export type Membership = typeof memberships.$inferSelect
export type NewMembership = typeof memberships.$inferInsert
export type AccountToken = typeof accountTokens.$inferSelect
export type AuditEntry = typeof auditLog.$inferSelect
export type ScenarioRow = typeof scenarios.$inferSelect
export type NewScenarioRow = typeof scenarios.$inferInsert
export type ScenarioAttachment = typeof scenarioAttachments.$inferSelect
export type ExerciseAttachment = typeof exerciseAttachments.$inferSelect
