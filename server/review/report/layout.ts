import type { Content, ContentTable, DynamicContent, Node, NodeQueries, StyleDictionary, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces'
import { breakLongWords, pdfSafe } from '#shared/review/pdftext'
import { utcText } from '#shared/review/format'
import { zonedText } from '#shared/utils/zone'
import { DRILL_CAUTION, DRILL_MARKING } from '#shared/utils/drill'

/** The app's palette (tailwind.config.ts) for print. */
export const PDF_INK = {
  text: '#17202c', muted: '#526c84', rule: '#c6d2dc', faint: '#f3f6f8', heading: '#0d5c81',
  marking: '#fd9a2e', markingText: '#0d131b', caution: '#ffeed0',
  P: '#1f876b', S: '#0b73a0', M: '#d25d08', U: '#c22f45',
} as const

/** Text as the embedded fonts can print it, long words breakable (see shared/review/pdftext.ts). */
export const pt = (s: string | number | null | undefined): string => breakLongWords(pdfSafe(s === null || s === undefined ? '' : String(s)))

let zone = 'UTC'
/** The scenario's time zone for the document being laid out (each document sets it first; a worker lays out one at a time). */
export function setPdfZone(timeZone: string | undefined): void {
  zone = timeZone || 'UTC'
}

/** A scenario time: "4 Mar 2031 07:30 (UTC+1) · 06:30 UTC" ("4 Mar 2031 06:30 UTC" in a UTC scenario). */
export function pdfTime(iso: string | null | undefined, withYear = true): string {
  return pdfSafe(zonedText(iso, zone, { year: withYear }))
}

/** A wall-clock time of the drill itself, in UTC: "4 Mar 2031 06:30 UTC". */
export function pdfWallTime(iso: string | null | undefined, withYear = true): string {
  return utcText(iso, { year: withYear })
}

export const PDF_STYLES: StyleDictionary = {
  h1: { fontSize: 16, bold: true, color: PDF_INK.heading, margin: [0, 14, 0, 6] },
  h2: { fontSize: 12, bold: true, color: PDF_INK.text, margin: [0, 10, 0, 4] },
  h3: { fontSize: 10, bold: true, color: PDF_INK.text, margin: [0, 6, 0, 2] },
  muted: { color: PDF_INK.muted, fontSize: 8.5 },
  small: { fontSize: 8.5 },
  th: { bold: true, fontSize: 8.5, color: PDF_INK.muted },
  td: { fontSize: 8.5 },
  para: { margin: [0, 0, 0, 6], lineHeight: 1.2 },
}

/** The marking bar on top of every page. */
export function markingHeader(): DynamicContent {
  return () => ({
    margin: [40, 18, 40, 0],
    table: { widths: ['*'], body: [[{ text: DRILL_MARKING, alignment: 'center', bold: true, fontSize: 9, characterSpacing: 2, color: PDF_INK.markingText, fillColor: PDF_INK.marking, margin: [0, 3, 0, 3] }]] },
    layout: 'noBorders',
  })
}

/** The caution, a short label and the page number at the foot of every page. */
export function cautionFooter(label: string): DynamicContent {
  return (page, pages) => ({
    margin: [40, 10, 40, 0],
    stack: [
      { text: `${DRILL_MARKING}  ·  ${pt(DRILL_CAUTION)}`, fontSize: 7, color: PDF_INK.muted, alignment: 'center' },
      { columns: [{ text: pt(label), fontSize: 7, color: PDF_INK.muted }, { text: `Page ${page} of ${pages}`, fontSize: 7, color: PDF_INK.muted, alignment: 'right', width: 80 }], margin: [0, 3, 0, 0] },
    ],
  })
}

/** A page frame with marking header, caution footer and the app's fonts and styles. */
export function pdfDocument(
  title: string, footerLabel: string, content: Content[], extra: Partial<TDocumentDefinitions> = {},
): TDocumentDefinitions {
  return {
    info: { title: pt(`${DRILL_MARKING} ${title}`), creator: 'Brinkwater', producer: 'Brinkwater', subject: pt(DRILL_CAUTION) },
    pageSize: 'A4', pageMargins: [40, 50, 40, 52],
    header: markingHeader(), footer: cautionFooter(footerLabel),
    styles: PDF_STYLES, defaultStyle: { font: 'Plex', fontSize: 9.5, color: PDF_INK.text, lineHeight: 1.15 },
    // Headings carry headlineLevel so that keepHeadingsWithText can move them to the next page.
    content: content.map(c => (typeof c === 'object' && c && 'style' in c && typeof c.style === 'string' && /^h[123]$/.test(c.style) ? { ...c, headlineLevel: 1 } : c)),
    ...extra,
  }
}

/** A plain table: header row in muted bold, light rules, the header repeated on every page. */
export function pdfTable(
  head: string[], rows: TableCell[][], widths: Array<string | number>, opts: { fontSize?: number; groupRows?: boolean } = {},
): ContentTable {
  const fontSize = opts.fontSize ?? 8.5
  return {
    table: {
      headerRows: 1, keepWithHeaderRows: 1, dontBreakRows: true, widths,
      body: [head.map(h => ({ text: h, style: 'th', fontSize })), ...rows.map(r => r.map(c => (typeof c === 'string' ? { text: pt(c), fontSize } : c)))],
    },
    layout: {
      // Grouped rows (a title row, its figures, a comment) draw a rule only above each title row.
      hLineWidth: (i: number, node: ContentTable) => {
        if (i === 1) return 0.8
        if (!opts.groupRows) return 0.4
        const cell = node.table.body[i]?.[0] as { colSpan?: number; bold?: boolean } | undefined
        return i === node.table.body.length || (cell?.colSpan && cell.bold) ? 0.4 : 0
      },
      vLineWidth: () => 0,
      hLineColor: () => PDF_INK.rule, paddingTop: () => 2.5, paddingBottom: () => 2.5, paddingLeft: () => 3, paddingRight: () => 3,
    },
    margin: [0, 2, 0, 8],
  }
}

/** A P/S/M/U rating as a coloured badge cell. */
export function ratingCell(r: string | null): TableCell {
  if (!r) return { text: '—', color: PDF_INK.muted, fontSize: 8.5 }
  return { text: r, bold: true, color: '#ffffff', fillColor: PDF_INK[r as 'P' | 'S' | 'M' | 'U'] ?? PDF_INK.muted, alignment: 'center', fontSize: 8.5 }
}

/** A numbered section heading that enters the table of contents. */
export function sectionHeading(n: number, title: string, pageBreak = false): Content {
  return { text: `${n}  ${title}`, style: 'h1', tocItem: true, headlineLevel: 1, pageBreak: pageBreak ? 'before' : undefined }
}

/** Avoids a heading left alone at the foot of a page (pdfmake's pageBreakBefore hook). */
export function keepHeadingsWithText(node: Node, nodes: NodeQueries): boolean {
  return node.headlineLevel === 1 && nodes.getFollowingNodesOnPage().length === 0
}

/** Plain paragraphs from a text with blank lines between them. */
export function paragraphs(text: string, style = 'para'): Content[] {
  return text.split(/\n\s*\n/).map(p => p.trim()).filter(Boolean).map(p => ({ text: pt(p.replace(/\s*\n\s*/g, ' ')), style }))
}
