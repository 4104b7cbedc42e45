/** The closed sets of the after-action review: finding kinds, POETE elements, statuses, hotwash sections, feedback questions. */

export const FINDING_KINDS = ['strength', 'improvement'] as const
export type FindingKind = typeof FINDING_KINDS[number]
export const FINDING_KIND_LABELS: Record<FindingKind, string> = { strength: 'Strength', improvement: 'Area for improvement' }

/** Where a corrective action lands: the five capability elements practitioners name (plans, organisation, equipment, training, drills). */
export const POETE_ELEMENTS = ['planning', 'organization', 'equipment', 'training', 'exercises'] as const
export type PoeteElement = typeof POETE_ELEMENTS[number]
export const POETE_LABELS: Record<PoeteElement, string> = {
  planning: 'Planning', organization: 'Organization', equipment: 'Equipment', training: 'Training', exercises: 'Exercises',
}

export const ITEM_STATUSES = ['open', 'in-progress', 'done', 'cancelled'] as const
export type ItemStatus = typeof ITEM_STATUSES[number]
export const ITEM_STATUS_LABELS: Record<ItemStatus, string> = {
  'open': 'Open',
  'in-progress': 'In progress',
  'done': 'Done',
  'cancelled': 'Cancelled',
}

/** The hotwash notes: fixed sections that the analyst and the facilitator write together. */
export const HOTWASH_SECTIONS = [
  {
    key: 'summary',
    title: 'How the drill went',
    hint: 'The drill in a few lines: what was played, how far it got, anything that changed on the day.',
  },
  { key: 'strengths', title: 'What worked', hint: 'What the teams named as going well, in their words.' },
  { key: 'improvements', title: 'What to improve', hint: 'What the teams would do differently next time.' },
  { key: 'follow-up', title: 'Agreed follow-up', hint: 'Who does what next, before the improvement plan is written up.' },
] as const
export type HotwashSection = typeof HOTWASH_SECTIONS[number]['key']
export const HOTWASH_KEYS = HOTWASH_SECTIONS.map(s => s.key) as [HotwashSection, ...HotwashSection[]]

/** The participant feedback form: statements rated 1 (strongly disagree) to 5 (strongly agree). */
export const FEEDBACK_QUESTIONS = [
  { key: 'objectives', text: 'The drill exercised the objectives it set out to exercise.' },
  { key: 'realism', text: 'The scenario and its figures were realistic enough to practise on.' },
  { key: 'figures', text: 'I could read the hazard figures and act on them as they changed.' },
  { key: 'coordination', text: 'Information reached the other teams when they needed it.' },
  { key: 'pace', text: 'The pace of the clock left enough time to decide.' },
] as const
export type FeedbackQuestion = typeof FEEDBACK_QUESTIONS[number]['key']
export const FEEDBACK_SCALE = ['Strongly disagree', 'Disagree', 'Neither', 'Agree', 'Strongly agree'] as const

/**
 * The four ratings of a critical task, P, S, M and U as the trade writes them; what each means is said here in
 * Brinkwater's own words: by what the team's work did to the outcome.
 */
export const RATINGS = ['P', 'S', 'M', 'U'] as const
export const RATING_LABELS: Record<typeof RATINGS[number], string> = {
  P: 'Done as intended: complete, in time, no outside help',
  S: 'Done, with slips that did not change the outcome',
  M: 'Done in part, or late or rough enough to hurt the outcome',
  U: 'Not done, or done in a way that defeated its purpose',
}
