import { and, asc, eq, sql } from 'drizzle-orm'
import type { Scenario } from '#shared/scenario/schema'
import { objectiveCapabilities } from '#shared/review/capabilities'
import type { FindingInput, ImprovementInput } from '#shared/schemas/review'
import { improvementMergedSchema } from '#shared/schemas/review'
import type { FieldIssue } from '#shared/utils/issues'
import type { Finding, ImprovementItem } from '#shared/review/types'
import { fieldIssues } from '#shared/utils/issues'
import { liveExercise } from '../live'

type FindingRow = typeof schema.exerciseFindings.$inferSelect
type ItemRow = typeof schema.improvementItems.$inferSelect

const invalid = (issues: FieldIssue[]) => invalidFields(issues)

/** 400 unless the objective is one of the scenario's and the capability one of that objective's. */
function checkObjective(scenario: Scenario, input: { objectiveKey: string; capability: string }) {
  const caps = objectiveCapabilities(scenario, input.objectiveKey)
  if (!caps) throw invalid([{ path: 'objectiveKey', message: 'not an objective of this exercise' }])
  if (!caps.includes(input.capability)) throw invalid([{
    path: 'capability',
    message: `not a capability of this objective (${caps.join('; ')})`,
  }])
}

function findingOut(r: FindingRow): Finding {
  return {
    id: r.id,
    kind: r.kind,
    objectiveKey: r.objectiveKey,
    capability: r.capability,
    title: r.title,
    detail: r.detail,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  }
}

function itemOut(r: ItemRow): ImprovementItem {
  return {
    id: r.id, findingId: r.findingId, objectiveKey: r.objectiveKey, capability: r.capability, action: r.action, element: r.element,
    owner: r.owner, startDate: r.startDate, dueDate: r.dueDate, status: r.status,
    createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString(),
  }
}

export function listFindings(exerciseId: string) {
  return useDB().select().from(schema.exerciseFindings).where(eq(schema.exerciseFindings.exerciseId, exerciseId))
    .orderBy(asc(schema.exerciseFindings.createdAt), sql`rowid`).all().map(findingOut)
}

function findingRow(exerciseId: string, findingId: string): FindingRow {
  const row = useDB().select().from(schema.exerciseFindings)
    .where(and(eq(schema.exerciseFindings.exerciseId, exerciseId), eq(schema.exerciseFindings.id, findingId))).get()
  if (!row) throw notFound('No such finding in this exercise.')
  return row
}

export function createFinding(exerciseId: string, input: FindingInput, actorId: string) {
  checkObjective(liveExercise(useDB(), exerciseId).scenario, input)
  const row = useDB().insert(schema.exerciseFindings).values({
    exerciseId,
    ...input,
    createdBy: actorId,
    updatedBy: actorId,
  }).returning().get()
  audit(actorId, 'review.finding.create', exerciseId, { findingId: row.id, kind: row.kind })
  return findingOut(row)
}

export function updateFinding(exerciseId: string, findingId: string, patch: Partial<FindingInput>, actorId: string) {
  const before = findingRow(exerciseId, findingId)
  const next = { ...before, ...patch }
  checkObjective(liveExercise(useDB(), exerciseId).scenario, next)
  const row = useDB().update(schema.exerciseFindings).set({ ...patch, updatedBy: actorId })
    .where(eq(schema.exerciseFindings.id, findingId)).returning().get()
  // A strength answers no corrective action: items that pointed at it keep their text but lose the link.
  if (row.kind === 'strength') useDB().update(schema.improvementItems).set({ findingId: null }).where(eq(
    schema.improvementItems.findingId,
    findingId,
  )).run()
  audit(actorId, 'review.finding.update', exerciseId, { findingId, fields: Object.keys(patch) })
  return findingOut(row)
}

export function deleteFinding(exerciseId: string, findingId: string, actorId: string) {
  findingRow(exerciseId, findingId)
  useDB().delete(schema.exerciseFindings).where(eq(schema.exerciseFindings.id, findingId)).run()
  audit(actorId, 'review.finding.delete', exerciseId, { findingId })
}

export function listImprovements(exerciseId: string) {
  return useDB().select().from(schema.improvementItems).where(eq(schema.improvementItems.exerciseId, exerciseId))
    .orderBy(asc(schema.improvementItems.dueDate), asc(schema.improvementItems.createdAt), sql`rowid`).all().map(itemOut)
}

function itemRow(exerciseId: string, itemId: string): ItemRow {
  const row = useDB().select().from(schema.improvementItems)
    .where(and(eq(schema.improvementItems.exerciseId, exerciseId), eq(schema.improvementItems.id, itemId))).get()
  if (!row) throw notFound('No such item in this improvement plan.')
  return row
}

/** An item's finding must be an area for improvement of the same exercise. */
function checkItem(exerciseId: string, input: ImprovementInput) {
  checkObjective(liveExercise(useDB(), exerciseId).scenario, input)
  if (!input.findingId) return
  const f = useDB().select().from(schema.exerciseFindings)
    .where(and(eq(schema.exerciseFindings.exerciseId, exerciseId), eq(schema.exerciseFindings.id, input.findingId))).get()
  if (!f) throw invalid([{ path: 'findingId', message: 'not a finding of this exercise' }])
  if (f.kind !== 'improvement') throw invalid([{
    path: 'findingId',
    message: 'a corrective action answers an area for improvement, not a strength',
  }])
}

export function createImprovement(exerciseId: string, input: ImprovementInput, actorId: string) {
  checkItem(exerciseId, input)
  const row = useDB().insert(schema.improvementItems).values({
    exerciseId,
    ...input,
    findingId: input.findingId ?? null,
    createdBy: actorId,
    updatedBy: actorId,
  }).returning().get()
  audit(actorId, 'review.improvement.create', exerciseId, { itemId: row.id })
  return itemOut(row)
}

export function updateImprovement(exerciseId: string, itemId: string, patch: Partial<ImprovementInput>, actorId: string) {
  const before = itemOut(itemRow(exerciseId, itemId))
  const merged = improvementMergedSchema.safeParse({ ...before, ...patch })
  if (!merged.success) throw invalid(fieldIssues(merged.error))
  checkItem(exerciseId, merged.data)
  const row = useDB().update(schema.improvementItems).set({ ...patch, updatedBy: actorId })
    .where(eq(schema.improvementItems.id, itemId)).returning().get()
  audit(actorId, 'review.improvement.update', exerciseId, { itemId, fields: Object.keys(patch) })
  return itemOut(row)
}

export function deleteImprovement(exerciseId: string, itemId: string, actorId: string) {
  itemRow(exerciseId, itemId)
  useDB().delete(schema.improvementItems).where(eq(schema.improvementItems.id, itemId)).run()
  audit(actorId, 'review.improvement.delete', exerciseId, { itemId })
}
