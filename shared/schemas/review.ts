/** Request bodies and params of the review desk: findings, improvement plan, hotwash, feedback, report by e-mail. */
import { z } from 'zod'
import { keySchema } from '../scenario/schema'
import { FEEDBACK_QUESTIONS, FINDING_KINDS, HOTWASH_KEYS, ITEM_STATUSES, POETE_ELEMENTS } from '../review/plan'

const uuid = z.string().uuid('Not a valid id.')
const line = (what: string, max: number) => z.string().trim().min(1, `Enter ${what}.`).max(max, `At most ${max} characters.`)

/** A calendar date `YYYY-MM-DD` that exists. */
export const dateSchema = z.string().refine(
  s => /^\d{4}-\d{2}-\d{2}$/.test(s) && !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
  'A calendar date as YYYY-MM-DD.',
)

export const findingParamsSchema = z.object({ id: uuid, findingId: uuid })
export const improvementParamsSchema = z.object({ id: uuid, itemId: uuid })
export const hotwashParamsSchema = z.object({ id: uuid, section: z.enum(HOTWASH_KEYS) })
export const solutionReviewParamsSchema = z.object({ id: uuid, key: keySchema })

const findingShape = z.object({
  kind: z.enum(FINDING_KINDS, 'Choose strength or area for improvement.'),
  objectiveKey: keySchema,
  capability: line('the capability', 120),
  title: line('a short title', 200),
  detail: z.string().trim().max(8000, 'At most 8000 characters.'),
})
const someField = (v: object) => Object.keys(v).length > 0
// Patches come from shapes without defaults, so that a field left out stays as it was.
export const findingSchema = findingShape.extend({ detail: findingShape.shape.detail.default('') })
export const findingPatchSchema = findingShape.partial().refine(someField, 'Change at least one field.')
export type FindingInput = z.infer<typeof findingSchema>

const improvementShape = z.object({
  findingId: uuid.nullish(),
  objectiveKey: keySchema,
  capability: line('the capability', 120),
  action: line('the corrective action', 2000),
  element: z.enum(POETE_ELEMENTS, 'Choose Planning, Organization, Equipment, Training or Exercises.'),
  owner: line('an owner', 200),
  startDate: dateSchema,
  dueDate: dateSchema,
  status: z.enum(ITEM_STATUSES, 'Choose open, in progress, done or cancelled.'),
})
const isDate = (s: unknown): s is string => dateSchema.safeParse(s).success
const datesInOrder = (v: { startDate?: string; dueDate?: string }) => !isDate(v.startDate) || !isDate(v.dueDate) || v.dueDate >= v.startDate
const dueMessage = { path: ['dueDate'], message: 'The due date cannot be before the start date.' }

export const improvementSchema = improvementShape.extend({ status: improvementShape.shape.status.default('open') }).refine(datesInOrder, dueMessage)
export const improvementPatchSchema = improvementShape.partial().refine(someField, 'Change at least one field.')
export type ImprovementInput = z.infer<typeof improvementSchema>
/** The whole item after a patch, checked again (dates in order). */
export const improvementMergedSchema = improvementSchema

export const hotwashSchema = z.object({
  body: z.string().max(20_000, 'At most 20,000 characters.'),
  /** The revision the writer started from (0 when the section was empty); a stale one → 409. */
  revision: z.number().int().min(0),
})

const rating = z.number({ error: 'Choose 1 to 5.' }).int('Choose 1 to 5.').min(1, 'Choose 1 to 5.').max(5, 'Choose 1 to 5.')
export const feedbackSchema = z.object({
  ratings: z.object(
    Object.fromEntries(FEEDBACK_QUESTIONS.map(q => [q.key, rating])) as Record<typeof FEEDBACK_QUESTIONS[number]['key'],
    typeof rating>,
  ),
  wentWell: z.string().trim().max(4000, 'At most 4000 characters.').default(''),
  toImprove: z.string().trim().max(4000, 'At most 4000 characters.').default(''),
})
export type FeedbackInput = z.infer<typeof feedbackSchema>

const recipients = z.array(uuid).min(1, 'Choose at least one member.').max(200)
const message = z.string().trim().max(2000, 'At most 2000 characters.').default('')

// `waiting: true`: only the members who have not answered (the server picks them; who answered is never shown).
export const feedbackRequestSchema = z.object({ userIds: recipients.optional(), waiting: z.boolean().default(false), message })
export const reportSendSchema = z.object({ userIds: recipients, message })
