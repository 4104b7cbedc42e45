import { and, eq } from 'drizzle-orm'
import { feedbackSummary, type FeedbackEntry } from '#shared/review/feedback'
import { FEEDBACK_QUESTIONS, FEEDBACK_SCALE } from '#shared/review/plan'
import type { FeedbackInput } from '#shared/schemas/review'
import { DRILL_MARKING } from '#shared/utils/drill'
import { ROLE_LABELS } from '#shared/utils/roles'
import type { User } from '#shared/types/db'
import { getExercise } from '../library'
import { exerciseMembers } from './review'

/** The members an action names, all of them members of the exercise (400 with the path of any other). */
export function membersByIds(exerciseId: string, userIds: readonly string[]) {
  const members = exerciseMembers(exerciseId)
  const issues = userIds.flatMap((id, i) => (members.some(m => m.userId === id)
    ? []
    : [{
        path: `userIds[${i}]`,
        message: 'not a member of this exercise',
      }]))
  if (issues.length) throw invalidFields(issues)
  return members.filter(m => userIds.includes(m.userId))
}

/** The form as one member sees it: the questions and their earlier answers, if any. */
export function myFeedback(exerciseId: string, userId: string) {
  const exercise = getExercise(exerciseId)
  const row = useDB().select().from(schema.feedbackResponses)
    .where(and(eq(schema.feedbackResponses.exerciseId, exerciseId), eq(schema.feedbackResponses.userId, userId))).get()
  return {
    exercise: { id: exercise.id, title: exercise.title, status: exercise.status },
    questions: FEEDBACK_QUESTIONS, scale: FEEDBACK_SCALE,
    response: row
      ? {
          ratings: row.ratings,
          wentWell: row.wentWell,
          toImprove: row.toImprove,
          updatedAt: row.updatedAt.toISOString(),
        }
      : null,
  }
}

/** Stores a member's feedback; sending it again replaces the earlier answers. */
export function submitFeedback(exerciseId: string, userId: string, input: FeedbackInput) {
  const values = { ratings: input.ratings, wentWell: input.wentWell, toImprove: input.toImprove }
  const row = useDB().insert(schema.feedbackResponses).values({ exerciseId, userId, ...values })
    .onConflictDoUpdate({
      target: [schema.feedbackResponses.exerciseId, schema.feedbackResponses.userId],
      set: { ...values, updatedAt: new Date() },
    })
    .returning().get()
  return { ratings: row.ratings, wentWell: row.wentWell, toImprove: row.toImprove, updatedAt: row.updatedAt.toISOString() }
}

/**
 * Feedback for the review: the summary (comments in groups of at least three, see groupComments), who was asked, and
 * how many of them have not answered yet; never who answered (that, with a role and team, would name the writer).
 */
export function reviewFeedback(exerciseId: string) {
  const db = useDB()
  const rows = db.select({ r: schema.feedbackResponses, role: schema.memberships.role, teamKey: schema.memberships.teamKey })
    .from(schema.feedbackResponses)
    .leftJoin(
      schema.memberships,
      and(
        eq(schema.memberships.exerciseId, schema.feedbackResponses.exerciseId),
        eq(schema.memberships.userId, schema.feedbackResponses.userId),
      ),
    )
    .where(eq(schema.feedbackResponses.exerciseId, exerciseId)).orderBy(schema.feedbackResponses.updatedAt).all()
  const asked = db.select({ userId: schema.feedbackRequests.userId, at: schema.feedbackRequests.createdAt }).from(schema.feedbackRequests)
    .where(eq(schema.feedbackRequests.exerciseId, exerciseId)).all()
  const entries: FeedbackEntry[] = rows.map(({ r, role, teamKey }) => ({
    role, teamKey, wentWell: r.wentWell, toImprove: r.toImprove, ratings: r.ratings, submittedAt: r.updatedAt.toISOString(),
  }))
  const answered = new Set(rows.map(x => x.r.userId))
  const lastAsked = new Map<string, string>()
  for (const a of asked) lastAsked.set(a.userId, a.at.toISOString())
  const members = exerciseMembers(exerciseId)
  return {
    summary: feedbackSummary(entries, lastAsked.size),
    members: members.map(m => ({
      userId: m.userId, name: m.name, role: m.role, teamKey: m.teamKey, askedAt: lastAsked.get(m.userId) ?? null,
    })),
    /** Members who have not answered (the reader among them), for the reminder. */
    waiting: members.filter(m => !answered.has(m.userId)).length,
  }
}

/**
 * E-mails the feedback form (a link to /exercises/:id/feedback) to the chosen members, or to every
 * member but the sender; with `waiting`, only to those of them who have not answered. Only once the drill has
 * ended (409 before).
 */
export async function requestFeedback(exerciseId: string, input: { userIds?: string[]; waiting?: boolean; message: string }, sender: User) {
  const exercise = getExercise(exerciseId)
  if (exercise.status !== 'ended') throw conflict('Send the feedback form once the drill has ended.')
  let to = input.userIds ? membersByIds(exerciseId, input.userIds) : exerciseMembers(exerciseId).filter(m => m.userId !== sender.id)
  if (input.waiting) {
    const answered = new Set(useDB().select({ userId: schema.feedbackResponses.userId }).from(schema.feedbackResponses)
      .where(eq(schema.feedbackResponses.exerciseId, exerciseId)).all().map(r => r.userId))
    to = to.filter(m => !answered.has(m.userId))
  }
  const link = appLink(`/exercises/${exerciseId}/feedback`)
  for (const m of to) {
    await sendMail({
      to: m.email,
      subject: `[${DRILL_MARKING}] Your feedback on "${exercise.title}"`,
      text: [
        DRILL_MARKING, '',
        `Hello ${m.name},`, '',
        `"${exercise.title}" has ended. ${sender.name} asks for your feedback as ${ROLE_LABELS[m.role].toLowerCase()}: five short statements to rate and two questions, about five minutes.`,
        ...(input.message ? ['', input.message] : []),
        '', `Sign in and fill in the form here: ${link}`, '',
        'Your answers go to the after-action review by role and team, without your name.', '', DRILL_MARKING,
      ].join('\n'),
    })
  }
  if (to.length) useDB().insert(schema.feedbackRequests).values(to.map(m => ({ exerciseId, userId: m.userId, sentBy: sender.id }))).run()
  audit(sender.id, 'review.feedback.request', exerciseId, { recipients: to.map(m => m.userId) })
  return { sent: to.length }
}
