import DOMPurify from 'dompurify'
import MarkdownIt from 'markdown-it'

// Raw HTML is never passed through; the output is sanitised again in the browser.
const md = new MarkdownIt({ html: false, linkify: true, typographer: false })

/** Markdown to safe HTML, in the browser only (on the server it returns ''). */
export function renderMarkdown(text: string): string {
  if (!import.meta.client) return ''
  return DOMPurify.sanitize(md.render(text), { USE_PROFILES: { html: true } })
}
