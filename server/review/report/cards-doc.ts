import type { Content } from 'pdfmake/interfaces'
import { findHazardFields } from '#shared/scenario/fields'
import type { Inject, Scenario } from '#shared/scenario/schema'
import { renderDocument } from '../pdf-core'
import { PDF_INK, pdfDocument, pdfTime, pt, setPdfZone } from './layout'
import { markdownToPdf } from './markdown'

/** An unreleased body with each hazard field shown by its name, `[energyMt.p50]`, for the facilitator to fill in. */
export function bodyWithFieldNames(text: string): string {
  let out = ''
  let from = 0
  for (const f of findHazardFields(text)) {
    out += `${text.slice(from, f.start)}[${f.path}${f.unit ? ` in ${f.unit}` : ''}]`
    from = f.end
  }
  return (out + text.slice(from)).replaceAll('\\{{', '{{')
}

// pdfmake reads `width` and `id` on any node; its types list them only for some.
const box = (): Content => ({ canvas: [{ type: 'rect', x: 0, y: 2, w: 9, h: 9, lineWidth: 0.8, lineColor: PDF_INK.text }], width: 16 }) as Content

const RULE_PT = 22
const rules = (n: number, id?: string): Content => ({ id, canvas: Array.from({ length: n }, (_, i) => ({ type: 'line' as const, x1: 0, y1: RULE_PT * (i + 1), x2: 515, y2: RULE_PT * (i + 1), lineWidth: 0.5, lineColor: PDF_INK.rule })), margin: [0, 0, 0, 6] }) as Content

export interface CardState { released: boolean; body: string; note: string; lines: number }

function card(i: Inject, n: number, total: number, scenario: Scenario, state: CardState): Content[] {
  const teams = i.teams.map(k => scenario.teams.find(t => t.key === k)?.name ?? k).join(', ')
  const phase = scenario.phases.find(p => p.key === i.phase)?.title ?? i.phase
  const decision = i.decision
  return [
    { text: pt(`Inject card ${n} of ${total}  ·  ${i.kind}  ·  ${i.key}`), style: 'muted', pageBreak: n > 1 ? 'before' : undefined },
    // pdfmake's pageBreakBefore hook skips nodes that break before them, so the title carries the card's id.
    { id: `card-${n}`, text: pt(i.title), fontSize: 17, bold: true, margin: [0, 4, 0, 8] },
    { table: { widths: [70, '*'], body: [
      [{ text: 'Scenario time', style: 'th' }, { text: pdfTime(i.at), bold: true }],
      [{ text: 'Phase', style: 'th' }, pt(phase)],
      [{ text: 'To', style: 'th' }, pt(teams)],
      [{ text: 'Figures', style: 'th' }, { text: pt(state.note), fontSize: 8.5, color: PDF_INK.muted }],
    ] }, layout: 'lightHorizontalLines', margin: [0, 0, 0, 10] },
    ...markdownToPdf(state.body, 10.5),
    ...(i.attachments?.length ? [{ text: pt(`Attachments: ${i.attachments.map(a => a.name).join('; ')}`), style: 'muted', margin: [0, 0, 0, 6] } as Content] : []),
    ...(decision
      ? [
          { text: 'Decision', style: 'h2' } as Content,
          { text: pt(decision.prompt), margin: [0, 0, 0, 4] } as Content,
          ...(decision.choices ?? []).map(c => ({ columns: [box(), { text: pt(c), width: '*' }], margin: [6, 2, 0, 2] }) as Content),
          { text: `Answer by ${pdfTime(decision.deadline)} (scenario time).`, bold: true, margin: [0, 6, 0, 0] } as Content,
        ]
      : []),
    { text: decision ? 'Your decision and reasons' : 'Notes', style: 'h2', margin: [0, 12, 0, 0] },
    { columns: [{ text: 'Team: ______________________', width: '*' }, { text: 'Scenario time: ________________', width: '*' }, { text: 'Signed: ________________', width: '*' }], fontSize: 9, margin: [0, 4, 0, 0] },
    rules(state.lines, `rules-${n}`),
  ]
}

/** What the inject cards are made of: the frozen scenario's injects in time order and what each card shows. */
export interface CardsData {
  title: string
  scenario: Scenario
  injects: Inject[]
  states: CardState[]
}

/**
 * Renders the inject cards (in a worker thread). Laid out twice: the first pass measures where each card's
 * writing space starts, the second fills the rest of its page with ruled lines (at least three).
 */
export async function renderCards({ title, scenario, injects, states }: CardsData): Promise<Buffer> {
  setPdfZone(scenario.clock.timeZone)
  const build = () => {
    const content = injects.flatMap((inj, idx) => card(inj, idx + 1, injects.length, scenario, states[idx]!))
    return pdfDocument(`Inject cards: ${title}`, `Inject cards — ${title}`, content.length ? content : [{ text: 'This scenario has no injects.' }])
  }
  const cardPage = new Map<number, number>()
  await renderDocument({ ...build(), pageBreakBefore: (node) => {
    const id = typeof node.id === 'string' ? node.id : ''
    const n = Number(id.split('-')[1])
    const at = node.startPosition
    if (id.startsWith('card-')) cardPage.set(n, at.pageNumber)
    else if (id.startsWith('rules-')) {
      const room = at.pageInnerHeight * (1 - at.verticalRatio) - 8
      states[n - 1]!.lines = at.pageNumber === cardPage.get(n) ? Math.max(3, Math.min(16, Math.floor(room / RULE_PT))) : 3
    }
    return false
  } })
  return renderDocument(build())
}
