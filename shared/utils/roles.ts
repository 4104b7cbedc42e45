/** System roles: an admin manages accounts; everyone else is a member. */
export const SYSTEM_ROLES = ['admin', 'member'] as const
export type SystemRole = typeof SYSTEM_ROLES[number]

/** Roles held per exercise. A player also belongs to one team. */
export const EXERCISE_ROLES = ['facilitator', 'player', 'evaluator', 'analyst'] as const
export type ExerciseRole = typeof EXERCISE_ROLES[number]

export const ROLE_LABELS: Record<ExerciseRole, string> = {
  facilitator: 'Facilitator',
  player: 'Player',
  evaluator: 'Evaluator',
  analyst: 'After-action lead',
}

/** The desk of each exercise role; the after-action lead works on the review desk. */
const DESKS: Record<ExerciseRole, 'control' | 'room' | 'evaluate' | 'review'> = {
  facilitator: 'control',
  player: 'room',
  evaluator: 'evaluate',
  analyst: 'review',
}

/** The page each exercise role lands on: its desk in that exercise. */
export function roleHome(exerciseId: string, role: ExerciseRole): string {
  return `/exercises/${exerciseId}/${DESKS[role]}`
}
