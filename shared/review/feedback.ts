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

/** Fewest people whose comments are shown together: a smaller group could be traced to a person. */
export const FEEDBACK_MIN_GROUP = 3

/** Comments of a group of at least FEEDBACK_MIN_GROUP people, in alphabetical order (never in the order sent). */
export interface FeedbackCommentGroup {
  /** The group: a role and team, a role (any team), or everyone (both null). */
  role: ExerciseRole | null
  teamKey: string | null
  people: number
  wentWell: string[]
  toImprove: string[]
}

export interface FeedbackSummary {
  responses: number
  /** Members asked by e-mail (distinct). */
  invited: number
  questions: FeedbackQuestionSummary[]
  comments: FeedbackCommentGroup[]
  /** Comments held back because fewer than FEEDBACK_MIN_GROUP people wrote any. */
  commentsWithheld: number
}

/**
 * Groups the comments so that none can be traced to a person: by role and team where at least FEEDBACK_MIN_GROUP
 * people of that team wrote one, else by role; if any group would still be smaller, all comments form one group;
 * fewer than FEEDBACK_MIN_GROUP people in all: none are shown. No times, and the texts are sorted.
 */
export function groupComments(entries: readonly FeedbackEntry[]): { comments: FeedbackCommentGroup[]; withheld: number } {
  const writers = entries.filter(e => e.wentWell.trim() || e.toImprove.trim())
  if (writers.length < FEEDBACK_MIN_GROUP) return { comments: [], withheld: writers.length }
  const byKey = (key: (e: FeedbackEntry) => string) => {
    const m = new Map<string, FeedbackEntry[]>()
    for (const e of writers) m.set(key(e), [...(m.get(key(e)) ?? []), e])
    return m
  }
  const teams = byKey(e => `${e.role ?? ''}|${e.teamKey ?? ''}`)
  const groups: FeedbackEntry[][] = []
  const leftOver: FeedbackEntry[] = []
  for (const list of teams.values()) {
    if (list.length >= FEEDBACK_MIN_GROUP) groups.push(list)
    else leftOver.push(...list)
  }
  const roles = new Map<string, FeedbackEntry[]>()
  for (const e of leftOver) roles.set(e.role ?? '', [...(roles.get(e.role ?? '') ?? []), e])
  const roleGroups = [...roles.values()]
  const all = roleGroups.every(g => g.length >= FEEDBACK_MIN_GROUP) ? [...groups, ...roleGroups] : [writers]
  const texts = (list: FeedbackEntry[], k: 'wentWell' | 'toImprove') => list.map(e => e[k].trim()).filter(Boolean).sort((a, b) => a.localeCompare(b))
  const comments = all.map((list) => {
    const sameRole = list.every(e => e.role === list[0]!.role)
    const sameTeam = sameRole && list.every(e => e.teamKey === list[0]!.teamKey)
    return {
      role: list === writers || !sameRole ? null : list[0]!.role,
      teamKey: list === writers || !sameTeam ? null : list[0]!.teamKey,
      people: list.length,
      wentWell: texts(list, 'wentWell'),
      toImprove: texts(list, 'toImprove'),
    }
  })
  return { comments, withheld: 0 }
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
  const { comments, withheld } = groupComments(entries)
  return { responses: entries.length, invited, questions, comments, commentsWithheld: withheld }
}
