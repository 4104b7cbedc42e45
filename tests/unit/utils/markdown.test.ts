// The client's renderer of inject bodies (app/utils/markdown.ts): markdown-it with raw HTML off, its
// output sanitised again by DOMPurify in the browser. DOMPurify needs a DOM, which these Node tests
// do not have: e2e/csp.spec.ts checks the whole renderer in Chromium. Here: the file keeps both
// stages, and the markdown stage, with the file's own options, turns script and event-handler HTML
// into text and javascript: links into nothing, whatever surrounds them.
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import fc from 'fast-check'
import MarkdownIt from 'markdown-it'
import { describe, expect, it } from 'vitest'

const source = readFileSync(resolve(import.meta.dirname, '../../../app/utils/markdown.ts'), 'utf8')
const options = /new MarkdownIt\((\{[^}]*\})\)/.exec(source)?.[1]
// The options literal of the file, read as data (keys and booleans only).
const md = new MarkdownIt(JSON.parse(options!.replace(/(\w+):/g, '"$1":')) as { html?: boolean; linkify?: boolean; typographer?: boolean })

const PAYLOADS = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '<svg/onload=alert(1)>',
  '<a href="javascript:alert(1)">x</a>',
  '[click](javascript:alert(1))',
  '[click](JaVaScRiPt:alert(1))',
  '[click](vbscript:msgbox(1))',
  '![x](javascript:alert(1))',
  '![x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
  '<iframe srcdoc="<script>alert(1)</script>"></iframe>',
  '<div onmouseover="alert(1)">hover</div>',
  '<style>body{display:none}</style>',
  '<a href="#" style="x" onclick="alert(1)">a</a>',
  '`<script>alert(1)</script>`',
  '```\n<script>alert(1)</script>\n```',
  '<<script>script>alert(1)<</script>/script>',
  '&lt;script&gt;alert(1)&lt;/script&gt;',
  '[a](https://example.org "title\' onmouseover=\'alert(1)")',
]
/** The tags markdown itself makes, with the attributes it sets. */
const TAGS = new Set([
  'p',
  'strong',
  'em',
  's',
  'a',
  'code',
  'pre',
  'ul',
  'ol',
  'li',
  'h1',
  'h2',
  'h3',
  'h4',
  'h5',
  'h6',
  'blockquote',
  'hr',
  'br',
  'img',
  'table',
  'thead',
  'tbody',
  'tr',
  'th',
  'td',
])
const ATTRIBUTES = new Set(['href', 'src', 'alt', 'title', 'start', 'style', 'class'])

/** Every tag of the output, with its attributes (the output is markdown-it's own, well formed). */
function tags(html: string) {
  return [...html.matchAll(/<\/?([a-zA-Z][\w-]*)([^>]*)>/g)].map(m => ({
    name: m[1]!.toLowerCase(),
    attributes: [...m[2]!.matchAll(/\s([^\s=]+)(?:="([^"]*)")?/g)].map(a => ({ name: a[1]!.toLowerCase(), value: a[2] ?? '' })),
  }))
}

function expectInert(html: string) {
  for (const tag of tags(html)) {
    expect(TAGS.has(tag.name), `<${tag.name}> in ${html}`).toBe(true)
    for (const a of tag.attributes) {
      expect(ATTRIBUTES.has(a.name), `${a.name}= in ${html}`).toBe(true)
      expect(a.value, html).not.toMatch(/^\s*(javascript|vbscript|data:text)/i)
    }
  }
}

describe('the inject body renderer', () => {
  it('keeps raw HTML off and sanitises the result with DOMPurify', () => {
    expect(options).toMatch(/html:\s*false/)
    // The rendered text (with the pending-figure marker styled) goes through DOMPurify before it is returned.
    expect(source).toMatch(/const html = md\.render\(text\)/)
    expect(source).toMatch(/return DOMPurify\.sanitize\(html,/)
  })

  it('renders script and event-handler HTML as text, and drops script links', () => {
    for (const payload of PAYLOADS) {
      const html = md.render(payload)
      expectInert(html)
      expect(html).not.toMatch(/<script|<img[^>]*onerror|<svg|<iframe|<style|onmouseover="|href="javascript/i)
    }
    expect(md.render(PAYLOADS[0]!)).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
  })

  it('stays inert whatever markdown surrounds the payloads', () => {
    const piece = fc.oneof(
      fc.constantFrom(...PAYLOADS),
      fc.string({ maxLength: 40 }),
      fc.constantFrom('**', '_', '# ', '> ', '- ', '1. ', '\n\n', '|a|b|\n|-|-|\n|', '[', '](', ')', '<', '>', '"', '`'),
    )
    fc.assert(fc.property(fc.array(piece, { maxLength: 12 }), (parts) => {
      expectInert(md.render(parts.join('')))
    }), { numRuns: 1000 })
  })
})
