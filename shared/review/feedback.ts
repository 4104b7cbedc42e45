/** Participant feedback collected after a drill, summarised for the review (by role and team, without names). */
import type { ExerciseRole } from '../utils/roles'
import { FEEDBACK_QUESTIONS, type FeedbackQuestion } from './plan'

export interface FeedbackEntry {
  role: ExerciseRole | null
  teamKey: string | null
  wentWell: string
  toImprove: string
  ratings: Partial<Record<FeedbackQuestion, number>>
  submittedAt: string
}

export interface FeedbackQuestionSummary {
  key: FeedbackQuestion
  text: string
  /** Answers 1..5 counted, index 0 for 1. */
  counts: [number, number, number, number, number]
  n: number
  mean: number | null
}

export interface FeedbackSummary {
  responses: number
  /** Members asked by e-mail (distinct). */
  invited: number
  questions: FeedbackQuestionSummary[]
  comments: Array<Pick<FeedbackEntry, 'role' | 'teamKey' | 'wentWell' | 'toImprove' | 'submittedAt'>>
}

export function feedbackSummary(entries: readonly FeedbackEntry[], invited: number): FeedbackSummary {
  const questions = FEEDBACK_QUESTIONS.map((q) => {
    const counts: FeedbackQuestionSummary['counts'] = [0, 0, 0, 0, 0]
    let sum = 0, n = 0
    for (const e of entries) {
      const v = e.ratings[q.key]
      if (typeof v === 'number' && v >= 1 && v <= 5) {
        counts[v - 1]! += 1
        sum += v
        n++
      }
    }
    return { key: q.key, text: q.text, counts, n, mean: n ? sum / n : null }
  })
  const comments = entries
    .filter(e => e.wentWell.trim() || e.toImprove.trim())
    .map(({ role, teamKey, wentWell, toImprove, submittedAt }) => ({ role, teamKey, wentWell, toImprove, submittedAt }))
  return { responses: entries.length, invited, questions, comments }
}
