import type { Scenario } from '#shared/scenario/schema'
import type { Exercise } from '#shared/types/db'

/** An exercise with its frozen scenario, as the live services use it. */
export type LiveExercise = Exercise & { scenario: Scenario }
