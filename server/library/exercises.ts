import { and, eq } from 'drizzle-orm'
import type { Exercise, ScenarioRow, User } from '#shared/types/db'
import type { ExerciseRole } from '#shared/utils/roles'

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

/** Starts an exercise from a library scenario: a frozen copy of the document and its attachments. */
export function startExercise(row: ScenarioRow, input: { title: string; description: string }, user: User) {
  return useDB().transaction((tx) => {
    const exercise = tx.insert(schema.exercises).values({
      title: input.title, description: input.description || row.document.summary.slice(0, 2000),
      createdBy: user.id, scenarioId: row.id, scenario: structuredClone(row.document),
    }).returning().get()
    tx.insert(schema.memberships).values({ exerciseId: exercise.id, userId: user.id, role: 'facilitator' }).run()
    const files = tx.select().from(schema.scenarioAttachments).where(eq(schema.scenarioAttachments.scenarioId, row.id)).all()
    for (const f of files) {
      tx.insert(schema.exerciseAttachments).values({
        exerciseId: exercise.id,
        path: f.path,
        name: f.name,
        contentType: f.contentType,
        size: f.size,
        sha256: f.sha256,
      }).run()
    }
    audit(user.id, 'exercise.start', exercise.id, { scenarioId: row.id, scenarioRevision: row.revision })
    return exercise
  })
}

/** Checks a role and team against an exercise's frozen scenario: players need one of its teams. */
export function checkTeam(exercise: Exercise, role: ExerciseRole, teamKey: string | null | undefined): string | null {
  if (role !== 'player') return null
  const teams = exercise.scenario?.teams.map(t => t.key) ?? []
  if (!teamKey || !teams.includes(teamKey)) {
    throw invalidFields(
      [{ path: 'teamKey', message: `unknown team "${teamKey ?? ''}" (teams: ${teams.join(', ') || 'none'})` }],
      'Choose one of the exercise\'s teams.',
    )
  }
  return teamKey
}

export function getExercise(id: string): Exercise {
  const exercise = useDB().select().from(schema.exercises).where(eq(schema.exercises.id, id)).get()
  if (!exercise) throw notFound('No such exercise.')
  return exercise
}

/** Every exercise keeps at least one facilitator. */
export function assertFacilitatorRemains(exerciseId: string, leavingUserId: string): void {
  const others = useDB().select({ userId: schema.memberships.userId }).from(schema.memberships)
    .where(and(eq(schema.memberships.exerciseId, exerciseId), eq(schema.memberships.role, 'facilitator'))).all()
    .filter(m => m.userId !== leavingUserId)
  if (others.length === 0) throw conflict('An exercise needs at least one facilitator.')
}
