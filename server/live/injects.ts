import { randomBytes } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { hasHazardFields, renderBody } from '#shared/live/headline'
import { phaseAt } from '#shared/live/schedule'
import { DRILL, teamsAudience } from '#shared/live/visibility'
import type { InjectData, InjectDefinition } from '#shared/live/types'
import { BUILT_IN_INJECT_KINDS } from '#shared/scenario/constants'
import { validateHazardFields } from '#shared/scenario/fields'
import { assessmentAt, type Published, publishedSolutions } from './assessments'
import { findIdempotent, liveWrite, type LiveWriter } from './record'
import type { LiveExercise } from './types'

/** An inject as the live services use it: a scenario inject, or an ad-hoc message's definition. */
export type InjectDef = InjectDefinition

type InjectRow = typeof schema.exerciseInjects.$inferSelect

/** Injects that are held or released, by key. */
export function injectRows(db: DB | Tx, exerciseId: string) {
  const rows = db.select().from(schema.exerciseInjects).where(eq(schema.exerciseInjects.exerciseId, exerciseId)).all()
  return new Map(rows.map(r => [r.injectKey, r]))
}

/** An inject of the exercise by key: the scenario's, or an ad-hoc message's stored definition. */
export function injectDef(exercise: LiveExercise, key: string, row?: InjectRow | null): InjectDef | null {
  if (row?.definition) return row.definition
  return exercise.scenario.injects.find(i => i.key === key) ?? null
}

/** The solution an inject shows: the one it presents (once published), else the latest published. */
function solutionFor(def: InjectDef, published: readonly Published[]): Published | null {
  return (def.solution && published.find(p => p.key === def.solution)) || published.at(-1) || null
}

export function renderInject(db: DB | Tx, exerciseId: string, def: InjectDef, published: readonly Published[]) {
  if (!hasHazardFields(def.body)) return { body: renderBody(def.body, null), solutionKey: null }
  const s = solutionFor(def, published)
  return { body: renderBody(def.body, s && assessmentAt(db, exerciseId, s.seq)), solutionKey: s?.key ?? null }
}

function attachmentRefs(tx: Tx, exerciseId: string, def: InjectDef) {
  if (!def.attachments?.length) return undefined
  const files = tx.select({ id: schema.exerciseAttachments.id, path: schema.exerciseAttachments.path }).from(schema.exerciseAttachments)
    .where(eq(schema.exerciseAttachments.exerciseId, exerciseId)).all()
  return def.attachments.map(a => ({ ...a, id: files.find(f => f.path === a.path)?.id ?? null }))
}

function injectData(w: LiveWriter, def: InjectDef, opts: { manual: boolean; wasHeld: boolean }): InjectData {
  const { body, solutionKey } = renderInject(w.tx, w.exercise.id, def, publishedSolutions(w.tx, w.exercise.id))
  const data: InjectData = {
    key: def.key, adhoc: !!def.adhoc, title: def.title, kind: def.kind, phase: def.phase, teams: def.teams, at: def.at,
    body, solutionKey, revision: 0, manual: opts.manual, wasHeld: opts.wasHeld, drill: DRILL,
  }
  if (def.decision) data.decision = def.decision
  const attachments = attachmentRefs(w.tx, w.exercise.id, def)
  if (attachments) data.attachments = attachments
  if (def.expectedActions) data.expectedActions = def.expectedActions
  if (def.contingency) data.contingency = def.contingency
  return data
}

/**
/** Lateness (scenario ms) past which an automatic release moves the decision's deadline: above the scheduler's own lag. */
export const LATE_RELEASE_MS = 60_000

/**
 * Why an inject's figures cannot be filled in now: it quotes hazard fields, and the solution it presents is not
 * published (or, presenting none, no solution is); null when they can. Names the solution to publish first.
 */
export function missingSolution(exercise: LiveExercise, def: InjectDef, published: readonly Published[]) {
  if (!hasHazardFields(def.body)) return null
  if (def.solution) {
    if (published.some(p => p.key === def.solution)) return null
    const entry = exercise.scenario.solutions.find(s => s.key === def.solution)
    return { solutionKey: def.solution, label: entry?.label ?? def.solution }
  }
  if (published.length) return null
  const first = exercise.scenario.solutions[0]
  return first ? { solutionKey: first.key, label: first.label } : { solutionKey: null, label: null }
}

/**
 * Releases a scenario inject to its teams, exactly once: by the scheduler when it falls due, or by
 * hand at any time (the only way for contingency and held injects). Already released → 409 with its seq.
 * By hand, an inject whose figures have no published solution yet is refused (409 `no-solution`, naming
 * the solution to publish) unless `force`: its teams then read "figures not yet available".
 */
export function releaseInject(exerciseId: string, key: string, opts: { actorId?: string | null; manual: boolean; force?: boolean }) {
  return liveWrite(exerciseId, (w) => {
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const scripted = injectDef(w.exercise, key)
    if (!scripted) throw notFound('No such inject in this exercise.')
    const row = w.tx.select().from(schema.exerciseInjects)
      .where(and(eq(schema.exerciseInjects.exerciseId, exerciseId), eq(schema.exerciseInjects.injectKey, key))).get()
    if (row?.status === 'released') throw conflict('This inject was already released.', { seq: row.releasedSeq })
    // Released by the scheduler later than scripted (a jump of the clock, a time with no process running): the decision
    // keeps the time the script allowed, its deadline moving by as much as the release came late.
    const late = opts.manual ? 0 : w.scenarioNow - Date.parse(scripted.at)
    const shift = late > LATE_RELEASE_MS ? late : 0
    const moved = (d: NonNullable<InjectDef['decision']>) => ({ ...d, deadline: new Date(Date.parse(d.deadline) + shift).toISOString() })
    const def: InjectDef = shift > 0 && scripted.decision ? { ...scripted, decision: moved(scripted.decision) } : scripted
    const missing = opts.manual && !opts.force ? missingSolution(w.exercise, def, publishedSolutions(w.tx, exerciseId)) : null
    if (missing) {
      throw conflict(
        missing.label
          ? `This inject quotes hazard figures of “${missing.label}”, which is not published yet: publish it first, or release anyway `
          + 'and its teams read “figures not yet available”.'
          : 'This inject quotes hazard figures, but the scenario has no orbit solution: release anyway and its teams read “figures not yet available”.',
        { code: 'no-solution', solutionKey: missing.solutionKey, label: missing.label },
      )
    }
    const data = injectData(w, def, { manual: opts.manual, wasHeld: row?.status === 'held' })
    const event = w.append({
      type: 'inject.released',
      audience: teamsAudience(def.teams, w.exercise.scenario.teams.map(t => t.key)),
      actorId: opts.actorId,
      data,
    })
    const values = {
      status: 'released' as const, releasedSeq: event.seq, body: data.body, solutionKey: data.solutionKey, revision: 0,
      // The moved deadline is the inject's from now on (answers, revisions and desks read it from the row).
      ...(def !== scripted ? { definition: def } : {}),
    }
    if (row) w.tx.update(schema.exerciseInjects).set(values).where(and(
      eq(schema.exerciseInjects.id, row.id),
      eq(schema.exerciseInjects.status, 'held'),
    )).run()
    else w.tx.insert(schema.exerciseInjects).values({ exerciseId, injectKey: key, ...values }).run()
    return event
  })
}

/** Holds a scenario inject so that the scheduler skips it; holding a held one changes nothing. */
export function holdInject(exerciseId: string, key: string, actorId: string) {
  return liveWrite(exerciseId, (w) => {
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const def = injectDef(w.exercise, key)
    if (!def) throw notFound('No such inject in this exercise.')
    const row = w.tx.select().from(schema.exerciseInjects)
      .where(and(eq(schema.exerciseInjects.exerciseId, exerciseId), eq(schema.exerciseInjects.injectKey, key))).get()
    if (row?.status === 'released') throw conflict('This inject was already released.', { seq: row.releasedSeq })
    if (row) return { created: false }
    w.tx.insert(schema.exerciseInjects).values({ exerciseId, injectKey: key, status: 'held' }).run()
    w.append({
      type: 'inject.held', audience: 'control', actorId,
      data: { key, title: def.title, at: def.at, teams: def.teams },
    })
    return { created: true }
  })
}

/** Checks an ad-hoc message against the exercise: known teams and kind, valid hazard fields (400 with field issues). */
function checkMessage(exercise: LiveExercise, input: { teams: string[]; body: string; kind: string }) {
  const { scenario } = exercise
  const teams = new Set(scenario.teams.map(t => t.key))
  const kinds = new Set<string>([...BUILT_IN_INJECT_KINDS, ...(scenario.injectKinds ?? [])])
  const issues = [
    ...input.teams.flatMap((t, i) => (teams.has(t) ? [] : [{ path: `teams[${i}]`, message: `unknown team "${t}"` }])),
    ...(kinds.has(input.kind) ? [] : [{ path: 'kind', message: `unknown kind "${input.kind}"` }]),
    ...validateHazardFields(input.body, scenario.sites.map(s => s.id)).map(i => ({
      path: 'body',
      message: `${i.line}:${i.column} ${i.message}`,
    })),
  ]
  if (issues.length) throw invalidFields(issues)
}

/** Sends an ad-hoc message from the facilitator, recorded and shown like an inject (`message.sent`). */
export function sendMessage(
  exerciseId: string,
  input: { teams: string[]; title: string; body: string; kind: string; idempotencyKey: string },
  actorId: string,
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, actorId, input.idempotencyKey, 'message.sent')
    if (again) return { event: again, created: false }
    if (w.exercise.status === 'ended') throw exerciseEnded()
    checkMessage(w.exercise, input)
    const def: InjectDef = {
      key: `msg-${randomBytes(5).toString('hex')}`, adhoc: true, at: new Date(w.scenarioNow).toISOString(),
      phase: phaseAt(
        w.exercise.scenario,
        w.scenarioNow,
      ), kind: input.kind, teams: [...new Set(input.teams)], title: input.title, body: input.body,
    }
    const data = injectData(w, def, { manual: true, wasHeld: false })
    const event = w.append({
      type: 'message.sent',
      audience: teamsAudience(def.teams, w.exercise.scenario.teams.map(t => t.key)),
      actorId,
      idempotencyKey: input.idempotencyKey,
      data,
    })
    w.tx.insert(schema.exerciseInjects).values({
      exerciseId, injectKey: def.key, status: 'released', definition: def,
      releasedSeq: event.seq, body: data.body, solutionKey: data.solutionKey,
    }).run()
    return { event, created: true }
  })
}
