import { and, asc, eq } from 'drizzle-orm'
import type { Assessment } from '#shared/hazard/types'
import type { SolutionPublishedData } from '#shared/live/types'

export interface Published { key: string; seq: number }

/** Published solutions of an exercise in publication order. */
export function publishedSolutions(db: DB | Tx, exerciseId: string): Published[] {
  return db.select({ key: schema.exerciseSolutions.solutionKey, seq: schema.exerciseSolutions.seq }).from(schema.exerciseSolutions)
    .where(eq(schema.exerciseSolutions.exerciseId, exerciseId)).orderBy(asc(schema.exerciseSolutions.seq)).all()
}

// Assessments are immutable once published; keep the most recent ones (≈ 60 kB each) in memory.
const assessments = new Map<string, Assessment>()
const MAX_CACHED = 64
export function rememberAssessment(key: string, a: Assessment) {
  assessments.set(key, a)
  if (assessments.size > MAX_CACHED) assessments.delete(assessments.keys().next().value!)
}

/** The stored assessment of a published solution (read from its event, kept in memory: it never changes). */
export function assessmentAt(db: DB | Tx, exerciseId: string, seq: number): Assessment {
  const key = `${exerciseId}:${seq}`
  let a = assessments.get(key)
  if (!a) {
    const row = db.select({ payload: schema.exerciseEvents.payload }).from(schema.exerciseEvents)
      .where(and(eq(schema.exerciseEvents.exerciseId, exerciseId), eq(schema.exerciseEvents.seq, seq))).get()
    if (!row) throw new Error(`no event ${seq} in exercise ${exerciseId}`)
    a = (row.payload as SolutionPublishedData).assessment
    rememberAssessment(key, a)
  }
  return a
}
