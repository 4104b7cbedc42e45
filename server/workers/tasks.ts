import { assessSolution } from '#shared/hazard/assess'
import type { OrbitSolution, Site } from '#shared/hazard/schema'
import { installPdfFonts, type PdfFonts, renderDocument } from '../review/pdf-core'
import { type CardsData, renderCards } from '../review/report/cards-doc'
import type { ReportData } from '../review/report/data'
import { finalMapSvg, type MapSource } from '../review/report/map'
import { reportDocument } from '../review/report/pdf'

/**
 * The work that runs off the main thread: a hazard assessment (the editor's preview, a publication)
 * and the PDFs. Everything here is pure computation on plain data, so it can run in a worker thread;
 * the server gathers the data, the pool (pool.ts) hands it over.
 */
export const TASKS = {
  assess: (input: { solution: OrbitSolution; sites: Site[]; samples: number; seed: number }) =>
    assessSolution(input.solution, input.sites, { samples: input.samples, seed: input.seed }),
  report: async ({ data, map }: { data: ReportData; map: MapSource | null }) =>
    renderDocument(reportDocument(map ? { ...data, map: await finalMapSvg(map, { fontFamily: 'Plex' }) } : data)),
  cards: (input: CardsData) => renderCards(input),
}
export type TaskKind = keyof typeof TASKS
export type TaskInput<K extends TaskKind> = Parameters<(typeof TASKS)[K]>[0]
export type TaskOutput<K extends TaskKind> = Awaited<ReturnType<(typeof TASKS)[K]>>

/** What a worker is started with. */
export interface WorkerSetup { fonts: PdfFonts }

export function setUpWorker(setup: WorkerSetup): void {
  installPdfFonts(setup.fonts)
}
