import MarkdownIt from 'markdown-it'
import type { Content } from 'pdfmake/interfaces'
import { pt } from './layout'

const md = new MarkdownIt({ html: false, linkify: false, typographer: false })
type Token = ReturnType<typeof md.parse>[number]
type Run = { text: string; bold?: boolean; italics?: boolean; font?: string }

function inline(tokens: Token[] | null): Run[] {
  const runs: Run[] = []
  let bold = false, italics = false
  for (const t of tokens ?? []) {
    if (t.type === 'strong_open') bold = true
    else if (t.type === 'strong_close') bold = false
    else if (t.type === 'em_open') italics = true
    else if (t.type === 'em_close') italics = false
    else if (t.type === 'text') runs.push({ text: pt(t.content), bold, italics })
    else if (t.type === 'code_inline') runs.push({ text: pt(t.content), font: 'PlexMono' })
    else if (t.type === 'softbreak') runs.push({ text: ' ' })
    else if (t.type === 'hardbreak') runs.push({ text: '\n' })
  }
  return runs
}

/**
 * Markdown (inject bodies) as pdfmake content: paragraphs, headings, bullet and numbered lists, bold,
 * italics and code. Raw HTML is never read; links print as their text.
 */
export function markdownToPdf(text: string, fontSize = 10): Content[] {
  const tokens = md.parse(text, {})
  const out: Content[] = []
  const lists: Array<{ ordered: boolean; items: Content[][] }> = []
  const items: Content[][] = []
  const put = (c: Content) => (items.at(-1) ?? out).push(c)
  let table: { rows: Array<Array<{ text: Run[]; bold: boolean }>>; head: number } | null = null
  for (const t of tokens) {
    switch (t.type) {
      case 'table_open':
        table = { rows: [], head: 0 }
        break
      case 'tr_open':
        table?.rows.push([])
        break
      case 'th_open':
        if (table && table.head < table.rows.length) table.head = table.rows.length
        break
      case 'table_close': {
        if (table?.rows.length) {
          const cols = Math.max(...table.rows.map(r => r.length))
          put({
            table: { headerRows: table.head, widths: Array.from({ length: cols }, (_, i) => (i === cols - 1 ? '*' : 'auto')), body: table.rows.map(r => Array.from({ length: cols }, (_, i) => ({ text: r[i]?.text ?? '', bold: r[i]?.bold ?? false, fontSize }))) },
            layout: 'lightHorizontalLines', margin: [0, 0, 0, 6],
          })
        }
        table = null
        break
      }
      case 'inline': {
        if (table) {
          table.rows.at(-1)?.push({ text: inline(t.children), bold: table.head >= table.rows.length })
          break
        }
        put({ text: inline(t.children), fontSize, margin: [0, 0, 0, items.length ? 2 : 5], lineHeight: 1.2 })
        break
      }
      case 'bullet_list_open':
      case 'ordered_list_open':
        lists.push({ ordered: t.type === 'ordered_list_open', items: [] })
        break
      case 'list_item_open':
        items.push([])
        break
      case 'list_item_close': {
        const done = items.pop()
        if (done) lists.at(-1)?.items.push(done)
        break
      }
      case 'bullet_list_close':
      case 'ordered_list_close': {
        const l = lists.pop()
        const items = l ? l.items.map(i => ({ stack: i })) : []
        if (l) put(l.ordered ? { ol: items, fontSize, margin: [0, 0, 0, 5] } : { ul: items, fontSize, margin: [0, 0, 0, 5] })
        break
      }
      case 'fence':
      case 'code_block':
        put({ text: pt(t.content), font: 'PlexMono', fontSize: fontSize - 1, margin: [0, 0, 0, 5] })
        break
    }
  }
  return out
}
