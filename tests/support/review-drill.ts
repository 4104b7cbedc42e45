// A short drill played through the API for the review tests: the clock started and paused, two
// solutions published, decisions answered on time and late, two evaluators rating the same six tasks
// (so that their agreement can be worked out by hand), an observation, and the clock ended.
import { expect } from 'vitest'
import { ikey, newLiveExercise, newPerson, type LiveCast, type Person } from './live'

export interface ReviewDrill extends LiveCast { evaluator2: Person }

/**
 * The six tasks and the two evaluators' final ratings. Evaluator 1 first rates the first task U and
 * then changes it to P, so only the later rating counts.
 * Agreement by hand: 4 of 6 agree (p_o = 2/3); marginals A = P2 S2 M1 U1, B = P1 S2 M2 U1, so
 * p_e = (2·1 + 2·2 + 1·2 + 1·1) / 36 = 1/4 and kappa = (2/3 − 1/4) / (1 − 1/4) = 5/9 (Cohen 1960).
 */
export const RATED: Array<{ criterionKey: string; taskKey: string; a: 'P' | 'S' | 'M' | 'U'; b: 'P' | 'S' | 'M' | 'U' }> = [
  { criterionKey: 'figures-of-record', taskKey: 'interpret-each-solution', a: 'P', b: 'P' },
  { criterionKey: 'figures-of-record', taskKey: 'flag-land-impact', a: 'S', b: 'S' },
  { criterionKey: 'figures-of-record', taskKey: 'compare-observations', a: 'S', b: 'M' },
  { criterionKey: 'notification-and-coordination', taskKey: 'notify-early', a: 'M', b: 'M' },
  { criterionKey: 'notification-and-coordination', taskKey: 'joint-cell', a: 'U', b: 'U' },
  { criterionKey: 'notification-and-coordination', taskKey: 'neighbour-liaison', a: 'P', b: 'S' },
]
export const KAPPA_BY_HAND = 5 / 9

async function ok(p: Promise<{ status: number; text: string }>, what: string) {
  const res = await p
  expect(res.status, `${what}: ${res.text}`).toBeLessThan(300)
  return res
}

export async function playReviewDrill(title: string): Promise<ReviewDrill> {
  const cast = await newLiveExercise(title)
  const f = cast.facilitator.client
  const id = cast.id
  const evaluator2 = await newPerson('Second evaluator')
  await ok(f.post(`/api/exercises/${id}/members`, { email: evaluator2.email, role: 'evaluator' }), 'add second evaluator')

  await ok(f.post(`/api/exercises/${id}/clock`, { action: 'start' }), 'start')
  await ok(f.post(`/api/exercises/${id}/clock`, { action: 'pause' }), 'pause')
  await ok(f.post(`/api/exercises/${id}/solutions/s1-discovery/publish`), 'publish s1')
  await ok(f.post(`/api/exercises/${id}/injects/notify-civil-protection/release`), 'release notify')
  await ok(f.post(`/api/exercises/${id}/injects/blogger-risk-table/release`), 'release blogger')
  await ok(cast.science.client.post(`/api/exercises/${id}/responses`, {
    injectKey: 'notify-civil-protection', choice: 'Formal notification under the hazard plan', text: 'Notify the duty officer by phone, then in writing.', idempotencyKey: ikey(),
  }), 'science answers')
  // Past the blogger deadline (6 March 20:00): the comms answer is late.
  await ok(f.post(`/api/exercises/${id}/clock`, { action: 'jump', to: '2031-03-07T00:00:00Z' }), 'jump')
  await ok(cast.comms.client.post(`/api/exercises/${id}/responses`, {
    injectKey: 'blogger-risk-table', choice: 'Issue a short holding statement today', text: 'Holding statement at 21:00.', idempotencyKey: ikey(),
  }), 'comms answers late')
  await ok(f.post(`/api/exercises/${id}/solutions/s7-certain/publish`), 'publish s7')

  const score = (c: Person, criterionKey: string, taskKey: string, rating: string, note: string) =>
    ok(c.client.post(`/api/exercises/${id}/scores`, { criterionKey, taskKey, rating, note, idempotencyKey: ikey() }), `score ${taskKey}`)
  await score(cast.evaluator, 'figures-of-record', 'interpret-each-solution', 'U', 'first look')
  for (const r of RATED) {
    await score(cast.evaluator, r.criterionKey, r.taskKey, r.a, `A on ${r.taskKey}`)
    await score(evaluator2, r.criterionKey, r.taskKey, r.b, `B on ${r.taskKey}`)
  }
  await ok(cast.evaluator.client.post(`/api/exercises/${id}/observations`, {
    text: 'Science cell phoned the duty officer within the hour.', injectKey: 'notify-civil-protection', teamKey: 'science', idempotencyKey: ikey(),
  }), 'observation')
  await ok(f.post(`/api/exercises/${id}/clock`, { action: 'end' }), 'end')
  return { ...cast, evaluator2 }
}
