/** The drill marking: common practice in exercises so that nobody takes drill traffic for a real alert. */
export const DRILL_MARKING = 'EXERCISE — EXERCISE — EXERCISE'

/** The caution that travels with every hazard figure. */
export const DRILL_CAUTION = 'Screening-level estimates from published simplified models, for training only. Real warnings come from the national authorities and their licensed experts.'
