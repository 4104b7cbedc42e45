// Security headers on every answer, a Content-Security-Policy, and a same-origin check on every
// state-changing request (CSRF): browsers send Origin (or Sec-Fetch-Site) with cross-site POST/PUT/PATCH/DELETE.
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

function refuse(): never {
  throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
}

export default defineEventHandler((event) => {
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
  // Chunked bodies declare no length: every read stops at the limit instead (Socket.IO's long-polling reads its own).
  if (!event.path.startsWith('/socket.io')) limitRequestBody(event)
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (site && site !== 'same-origin' && site !== 'none') refuse()
  const origin = getRequestHeader(event, 'origin')
  if (origin === 'null') refuse()
  if (origin) {
    const host = getRequestHeader(event, 'x-forwarded-host') && serverConfig().trustProxy
      ? getRequestHeader(event, 'x-forwarded-host')
      : getRequestHeader(event, 'host')
    let originHost: string
    try { originHost = new URL(origin).host }
    catch { refuse() }
    if (originHost !== host) refuse()
  }
})
