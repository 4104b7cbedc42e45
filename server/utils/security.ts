import { createHash } from 'node:crypto'

/**
 * The policy of every answer. Scripts: only this origin's files plus, on pages, the hashes of the
 * inline scripts Nuxt writes (window.__NUXT__ config; the JSON payload is data, not run). Styles
 * allow 'unsafe-inline' because Vue, ECharts and reka-ui set style attributes. Socket.IO needs
 * ws:/wss: in connect-src.
 */
export function contentSecurityPolicy(scriptHashes: readonly string[] = []): string {
  return [
    `default-src 'self'`,
    `script-src 'self'${scriptHashes.map(h => ` '${h}'`).join('')}`,
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' data: blob:`,
    `font-src 'self' data:`,
    `connect-src 'self' ws: wss:`,
    `worker-src 'self' blob:`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
  ].join('; ')
}

/** The CSP source expressions ('sha256-…') of the inline scripts a page runs (not JSON data blocks, not src= files). */
export function inlineScriptHashes(html: string): string[] {
  const hashes = new Set<string>()
  for (const m of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
    const attrs = m[1] ?? ''
    if (/\ssrc\s*=/i.test(attrs)) continue
    const type = /\stype\s*=\s*["']?([^"'\s>]+)/i.exec(attrs)?.[1]?.toLowerCase()
    if (type && !['module', 'text/javascript', 'application/javascript'].includes(type)) continue
    hashes.add(`sha256-${createHash('sha256').update(m[2] ?? '', 'utf8').digest('base64')}`)
  }
  return [...hashes]
}
