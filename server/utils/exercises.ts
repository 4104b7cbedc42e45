import { eq } from 'drizzle-orm'

/** The exercises a user belongs to, with the role and team held in each. */
export function listMemberships(userId: string) {
  return useDB().select({
    exerciseId: schema.exercises.id,
    title: schema.exercises.title,
    description: schema.exercises.description,
    status: schema.exercises.status,
    role: schema.memberships.role,
    teamKey: schema.memberships.teamKey,
  }).from(schema.memberships)
    .innerJoin(schema.exercises, eq(schema.memberships.exerciseId, schema.exercises.id))
    .where(eq(schema.memberships.userId, userId))
    .orderBy(schema.exercises.createdAt)
    .all()
}
