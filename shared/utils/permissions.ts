import type { LiveView } from '../live/types'
import type { ExerciseRole } from './roles'

/** What a caller may do in one exercise. */
export const CAPABILITIES = [
  'exercise.read', // the exercise page, its members and attachments
  'live.follow', // the live snapshot, the event record and the live socket
  'live.control', // clock, releases, holds, solutions, messages, wall links
  'live.evaluate', // scores and observations
  'live.respond', // a team's responses
  'review.read', // the review desk
  'review.write', // findings, improvement plan, hotwash notes, mailings
  'review.export', // timeline downloads, report and inject cards
  'feedback.give', // the participant feedback form
  'members.manage', // adding, changing and removing members
] as const
export type Capability = typeof CAPABILITIES[number]

/** Who holds a capability: an exercise role, or an admin looking in without a drill role. */
export type ExerciseStanding = ExerciseRole | 'admin-visitor'

/** The one permission table: every guard, the live socket and the `can` flags sent to pages read it. */
export const PERMISSIONS: Record<ExerciseStanding, readonly Capability[]> = {
  'facilitator': [
    'exercise.read', 'live.follow', 'live.control', 'live.evaluate', 'review.read', 'review.write', 'review.export',
    'feedback.give', 'members.manage',
  ],
  'player': ['exercise.read', 'live.follow', 'live.respond', 'feedback.give'],
  'evaluator': ['exercise.read', 'live.follow', 'live.evaluate', 'review.read', 'feedback.give'],
  'analyst': ['exercise.read', 'live.follow', 'review.read', 'review.write', 'review.export', 'feedback.give'],
  'admin-visitor': ['exercise.read', 'live.follow', 'review.read', 'review.export'],
}

export function hasCapability(standing: ExerciseStanding, capability: Capability): boolean {
  return PERMISSIONS[standing].includes(capability)
}

/** Every capability with whether the standing holds it, as pages receive it. */
export function capabilityFlags(standing: ExerciseStanding): Record<Capability, boolean> {
  return Object.fromEntries(CAPABILITIES.map(c => [c, hasCapability(standing, c)])) as Record<Capability, boolean>
}

/** The reader view of a membership; an admin looking in without a drill role reads as an evaluator. */
export function viewOf(membership: { role: ExerciseRole; teamKey: string | null } | null): LiveView {
  if (!membership) return { kind: 'evaluator' }
  if (membership.role === 'facilitator') return { kind: 'control' }
  if (membership.role === 'player') return { kind: 'player', teamKey: membership.teamKey ?? '' }
  return { kind: 'evaluator' }
}
