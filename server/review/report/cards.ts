import { findHazardFields } from '#shared/scenario/fields'
import { injectRows, liveExercise } from '../../live'
import { runTask } from '../../workers/pool'
import { bodyWithFieldNames, type CardState } from './cards-doc'
import { type ReportData, reportParts } from './data'

/**
 * Printable inject cards: one page per inject of the frozen scenario, in scenario-time order. A
 * released inject shows its body with the figures it carries now; an unreleased one shows the hazard
 * fields by name. Expected actions and contingency conditions never appear (the cards go to players).
 * Rendered in a worker thread (renderCards).
 */
export async function injectCardsPdf(exerciseId: string): Promise<Buffer> {
  const exercise = liveExercise(useDB(), exerciseId)
  const { scenario } = exercise
  const rows = injectRows(useDB(), exerciseId)
  const labels = new Map(scenario.solutions.map(s => [s.key, s.label]))
  const injects = [...scenario.injects].sort((a, b) => Date.parse(a.at) - Date.parse(b.at))
  const states: CardState[] = injects.map((inj) => {
    const row = rows.get(inj.key)
    const released = row?.status === 'released' && row.body !== null
    const note = findHazardFields(inj.body).length === 0
      ? 'This inject quotes no hazard figures.'
      : released
        ? `As released, with the figures of ${labels.get(row!.solutionKey ?? '') ?? 'no published solution'}${row!.revision ? ` (revision ${row!.revision})` : ''}.`
        : 'Not released yet: hazard figures appear as field names in [brackets]; fill them in from the current hazard brief.'
    return { released, body: released ? row!.body! : bodyWithFieldNames(inj.body), note, lines: 1 }
  })
  return runTask('cards', { title: exercise.title, scenario, injects, states })
}

/** The after-action report with its map as PDF bytes, drawn and rendered in a worker thread (reportDocument), and its data. */
export async function reportPdf(exerciseId: string): Promise<{ data: ReportData; pdf: Buffer }> {
  const { data, mapSource } = reportParts(exerciseId)
  return { data, pdf: await runTask('report', { data, map: mapSource }) }
}
