import { createHash } from 'node:crypto'

// Security headers on every answer, a Content-Security-Policy, and a same-origin check on every
// state-changing request (CSRF): browsers send Origin (or Sec-Fetch-Site) with cross-site POST/PUT/PATCH/DELETE.
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])
/** Largest request body read at all: the 5 MiB attachment limit plus room for the multipart envelope. */
const MAX_BODY_BYTES = 6 * 1024 * 1024

// The session cookie is Secure when the app is served over HTTPS (NUXT_SECURE_COOKIES=1 or an https
// NUXT_APP_URL). nuxt-auth-utils reads runtimeConfig.session per request, where the environment
// variable NUXT_SESSION_COOKIE_SECURE lands; this module is loaded at start, before any request.
if (process.env.NUXT_SESSION_COOKIE_SECURE === undefined
  && (['1', 'true'].includes(process.env.NUXT_SECURE_COOKIES ?? '') || /^https:/i.test(process.env.NUXT_APP_URL ?? ''))) {
  process.env.NUXT_SESSION_COOKIE_SECURE = 'true'
}

/**
 * The policy of every answer. Scripts: only this origin's files plus, on pages, the hashes of the
 * inline scripts Nuxt writes (window.__NUXT__ config; the JSON payload is data, not run). Styles
 * allow 'unsafe-inline' because Vue, ECharts and reka-ui set style attributes. Socket.IO needs
 * ws:/wss: in connect-src.
 */
function contentSecurityPolicy(scriptHashes: readonly string[] = []): string {
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
function inlineScriptHashes(html: string): string[] {
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

let pageHook = false
/** Rendered pages get the policy with the hashes of their own inline scripts (Nitro's render:response hook). */
function hookPages() {
  if (pageHook || import.meta.dev) return
  pageHook = true
  useNitroApp().hooks.hook('render:response', (response) => {
    if (typeof response.body !== 'string') return
    response.headers = { ...response.headers, 'content-security-policy': contentSecurityPolicy(inlineScriptHashes(response.body)) }
  })
}

function refuse(): never {
  throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
}

export default defineEventHandler((event) => {
  hookPages()
  setResponseHeaders(event, {
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Referrer-Policy': 'same-origin',
    'Permissions-Policy': 'camera=(), microphone=(), geolocation=(), payment=()',
    'Cross-Origin-Opener-Policy': 'same-origin',
    ...(import.meta.dev ? {} : { 'Content-Security-Policy': contentSecurityPolicy() }),
  })
  if (!UNSAFE.has(event.method)) return
  if (Number(getRequestHeader(event, 'content-length') ?? 0) > MAX_BODY_BYTES) {
    throw createError({ statusCode: 413, message: `The request is too large (limit ${MAX_BODY_BYTES / 1024 / 1024} MiB).` })
  }
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (site && site !== 'same-origin' && site !== 'none') refuse()
  const origin = getRequestHeader(event, 'origin')
  if (origin === 'null') refuse()
  if (origin) {
    const host = getRequestHeader(event, 'x-forwarded-host') && process.env.NUXT_TRUST_PROXY === '1'
      ? getRequestHeader(event, 'x-forwarded-host')
      : getRequestHeader(event, 'host')
    let originHost: string
    try { originHost = new URL(origin).host }
    catch { refuse() }
    if (originHost !== host) refuse()
  }
})
