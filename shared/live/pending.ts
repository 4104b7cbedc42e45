/**
 * What stands in an inject's text for a hazard figure whose orbit solution is not published yet. The pages show it
 * styled as "figures not yet available" (app/utils/markdown.ts); the PDFs print it in brackets.
 */
export const NO_SOLUTION_YET = '⟨figures not yet available⟩'
