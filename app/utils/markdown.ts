import DOMPurify from 'dompurify'
import MarkdownIt from 'markdown-it'
import { NO_SOLUTION_YET } from '~~/shared/live/pending'

// Raw HTML is never passed through; the output is sanitised again in the browser.
const md = new MarkdownIt({ html: false, linkify: true, typographer: false })

/** Markdown to safe HTML, in the browser only (on the server it returns ''). A figure not yet available gets its own style. */
export function renderMarkdown(text: string): string {
  if (!import.meta.client) return ''
  const html = md.render(text).replaceAll(NO_SOLUTION_YET, '<span class="bw-pending-figure" title="Its orbit solution is not published yet">figures not yet available</span>')
  return DOMPurify.sanitize(html, { USE_PROFILES: { html: true } })
}
