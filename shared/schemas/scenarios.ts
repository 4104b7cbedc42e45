import { z } from 'zod'
import { keySchema } from '../scenario/schema'
import { orbitSolutionSchema, siteSchema } from '../hazard/schema'
import { EXERCISE_ROLES } from '../utils/roles'
import { emailSchema } from '../utils/password'

export const createScenarioSchema = z.object({
  title: z.string().trim().min(1, 'Enter a title.').max(200),
  key: keySchema.optional(),
})

/** A save from the editor: the whole document and the revision it was loaded at. */
export const saveScenarioSchema = z.object({
  revision: z.number().int().min(1),
  document: z.unknown(),
})

export const importQuerySchema = z.object({
  /** What to do when the file's key is already in the library. */
  onConflict: z.enum(['refuse', 'copy', 'replace']).default('refuse'),
})

export const startExerciseSchema = z.object({
  title: z.string().trim().min(1, 'Enter a title.').max(200),
  description: z.string().trim().max(2000).default(''),
})

/** A live preview in the editor: an (unsaved) solution and the scenario's sites. */
export const previewSchema = z.object({
  solution: orbitSolutionSchema,
  sites: z.array(siteSchema).max(200).default([]),
  samples: z.number().int().min(500).max(20_000).default(5000),
  // The engine takes any safe integer and uses all of it.
  seed: z.number().int().min(-Number.MAX_SAFE_INTEGER).max(Number.MAX_SAFE_INTEGER).default(1),
})

export const memberSchema = z.object({
  email: emailSchema,
  role: z.enum(EXERCISE_ROLES),
  teamKey: keySchema.nullish(),
}).refine(m => m.role !== 'player' || !!m.teamKey, { path: ['teamKey'], message: 'A player needs a team.' })

export const memberPatchSchema = z.object({
  role: z.enum(EXERCISE_ROLES),
  teamKey: keySchema.nullish(),
}).refine(m => m.role !== 'player' || !!m.teamKey, { path: ['teamKey'], message: 'A player needs a team.' })

export const exerciseMemberParams = z.object({ id: z.string().uuid('Not a valid id.'), userId: z.string().uuid('Not a valid id.') })
export const attachmentParams = z.object({ id: z.string().uuid('Not a valid id.'), attachmentId: z.string().uuid('Not a valid id.') })

/** Import of an inject list: the revision the editor holds (409 when the scenario moved on); without it, the current one. */
export const mselImportQuerySchema = z.object({
  revision: z.coerce.number().int().min(1).optional(),
})
