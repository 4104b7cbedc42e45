import { randomUUID } from 'node:crypto'
import { and, eq, inArray } from 'drizzle-orm'
import type { Membership, User } from '#shared/types/db'
import { zoneFigures, type ZoneKind, type ZoneShape } from '#shared/geo/zones'
import type { ZoneDrawnData, ZoneWithdrawnData } from '#shared/live/types'
import { assessmentAt, publishedSolutions } from './assessments'
import { injectDef, injectRows } from './injects'
import { findIdempotent, liveWrite } from './record'

const by = (user: User) => ({ id: user.id, name: user.name })

/**
 * A player's response to an inject released to their team (a decision choice and/or text). The same
 * idempotency key returns the first response without a second event.
 */
export function submitResponse(
  exerciseId: string,
  user: User,
  membership: Membership,
  input: { injectKey: string; choice?: string | null; text: string; injectRevision?: number; idempotencyKey: string },
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, user.id, input.idempotencyKey, 'response.submitted')
    if (again) return { event: again, created: false }
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const teamKey = membership.teamKey ?? ''
    const row = w.tx.select().from(schema.exerciseInjects)
      .where(and(eq(schema.exerciseInjects.exerciseId, exerciseId), eq(schema.exerciseInjects.injectKey, input.injectKey))).get()
    const def = row?.status === 'released' ? injectDef(w.exercise, input.injectKey, row) : null
    if (!def || !def.teams.includes(teamKey)) throw notFound('No such inject in your team\'s traffic.')
    if (input.choice && !def.decision?.choices?.includes(input.choice)) throw badField(
      'choice',
      def.decision?.choices ? 'not one of the choices' : 'this inject offers no choices',
    )
    const late = def.decision ? w.scenarioNow > Date.parse(def.decision.deadline) : false
    // The revision the team had on screen: a later one may have arrived while they wrote.
    const injectRevision = input.injectRevision ?? row!.revision
    if (injectRevision > row!.revision) throw badField('injectRevision', `this inject has no revision ${injectRevision} yet`)
    const event = w.append({
      type: 'response.submitted', audience: `teams:${teamKey}`, actorId: user.id, idempotencyKey: input.idempotencyKey,
      data: {
        id: randomUUID(), injectKey: input.injectKey, teamKey, choice: input.choice ?? null, text: input.text, late, by: by(user),
        injectRevision,
      },
    })
    return { event, created: true }
  })
}

/** An evaluator's P/S/M/U rating of one critical task of a criterion, with a note. */
export function recordScore(
  exerciseId: string,
  user: User,
  input: { criterionKey: string; taskKey: string; rating: 'P' | 'S' | 'M' | 'U'; note: string; idempotencyKey: string },
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, user.id, input.idempotencyKey, 'score.recorded')
    if (again) return { event: again, created: false }
    const criterion = w.exercise.scenario.criteria.find(c => c.key === input.criterionKey)
    if (!criterion) throw badField('criterionKey', 'no such criterion in this exercise')
    if (!criterion.tasks.some(t => t.key === input.taskKey)) throw badField('taskKey', 'no such task in this criterion')
    const event = w.append({
      type: 'score.recorded', audience: 'evaluators', actorId: user.id, idempotencyKey: input.idempotencyKey,
      data: {
        id: randomUUID(),
        criterionKey: input.criterionKey,
        taskKey: input.taskKey,
        rating: input.rating,
        note: input.note,
        by: by(user),
      },
    })
    return { event, created: true }
  })
}

/** A timestamped observation by an evaluator, optionally about an inject and a team. */
export function recordObservation(
  exerciseId: string,
  user: User,
  input: { text: string; injectKey?: string | null; teamKey?: string | null; idempotencyKey: string },
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, user.id, input.idempotencyKey, 'observation.recorded')
    if (again) return { event: again, created: false }
    if (input.teamKey && !w.exercise.scenario.teams.some(t => t.key === input.teamKey)) throw badField(
      'teamKey',
      'no such team in this exercise',
    )
    if (input.injectKey && !injectDef(
      w.exercise,
      input.injectKey,
      injectRows(w.tx, exerciseId).get(input.injectKey),
    )) throw badField('injectKey', 'no such inject in this exercise')
    const event = w.append({
      type: 'observation.recorded', audience: 'evaluators', actorId: user.id, idempotencyKey: input.idempotencyKey,
      data: { id: randomUUID(), text: input.text, injectKey: input.injectKey ?? null, teamKey: input.teamKey ?? null, by: by(user) },
    })
    return { event, created: true }
  })
}

/**
 * A team's message to control, or to another team through control (control reads it and passes it on or answers):
 * recorded as `team.message` for the sending team and control (evaluators read it too). The same idempotency key
 * sends it once.
 */
export function sendTeamMessage(
  exerciseId: string,
  user: User,
  membership: Membership,
  input: { to: string; body: string; idempotencyKey: string },
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, user.id, input.idempotencyKey, 'team.message')
    if (again) return { event: again, created: false }
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const from = membership.teamKey ?? ''
    if (input.to !== 'control' && !w.exercise.scenario.teams.some(t => t.key === input.to)) throw badField('to', 'no such team')
    if (input.to === from) throw badField('to', 'write to control or to another team')
    const event = w.append({
      type: 'team.message', audience: `teams:${from}`, actorId: user.id, idempotencyKey: input.idempotencyKey,
      data: { id: randomUUID(), from, to: input.to, body: input.body, by: by(user) },
    })
    return { event, created: true }
  })
}

/** Who draws a zone: a player for their team, or control (`control`). */
export interface ZoneAuthor { user: User; teamKey: string }

/**
 * A protective-action zone drawn on the hazard map (`zone.drawn`, audience all: every team, the staff and the wall
 * see it). Its figures — the sites and people inside, and per threshold the chance that the damage reaches beyond it
 * — are worked out here against the solution current when it is drawn, and kept with it for the after-action record.
 */
export function drawZone(
  exerciseId: string,
  author: ZoneAuthor,
  input: { kind: ZoneKind; name: string; note: string; shape: ZoneShape; idempotencyKey: string },
) {
  return liveWrite(exerciseId, (w) => {
    const again = findIdempotent(w.tx, exerciseId, author.user.id, input.idempotencyKey, 'zone.drawn')
    if (again) return { event: again, created: false }
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const current = publishedSolutions(w.tx, exerciseId).at(-1)
    const figures = current
      ? zoneFigures(input.shape, current.key, assessmentAt(w.tx, exerciseId, current.seq), w.exercise.scenario.sites)
      : null
    const event = w.append({
      type: 'zone.drawn', audience: 'all', actorId: author.user.id, idempotencyKey: input.idempotencyKey,
      data: {
        id: randomUUID(), teamKey: author.teamKey, kind: input.kind, name: input.name, note: input.note, shape: input.shape,
        figures, by: by(author.user),
      },
    })
    return { event, created: true }
  })
}

/** Takes a zone back: its own team or control may; once only (again → 409). */
export function withdrawZone(exerciseId: string, author: ZoneAuthor, zoneId: string) {
  return liveWrite(exerciseId, (w) => {
    if (w.exercise.status === 'ended') throw exerciseEnded()
    const zones = w.tx.select({ payload: schema.exerciseEvents.payload, type: schema.exerciseEvents.type }).from(schema.exerciseEvents)
      .where(and(eq(schema.exerciseEvents.exerciseId, exerciseId), inArray(schema.exerciseEvents.type, ['zone.drawn', 'zone.withdrawn']))).all()
    const drawn = zones.find(z => z.type === 'zone.drawn' && (z.payload as ZoneDrawnData).id === zoneId)?.payload as ZoneDrawnData | undefined
    if (!drawn) throw notFound('No such zone.')
    if (author.teamKey !== 'control' && drawn.teamKey !== author.teamKey) throw forbidden('Only the team that drew this zone, or control, may withdraw it.')
    if (zones.some(z => z.type === 'zone.withdrawn' && (z.payload as ZoneWithdrawnData).id === zoneId)) throw conflict('This zone was already withdrawn.')
    const event = w.append({
      type: 'zone.withdrawn', audience: 'all', actorId: author.user.id,
      data: { id: zoneId, teamKey: drawn.teamKey, name: drawn.name, by: by(author.user) },
    })
    return { event }
  })
}
