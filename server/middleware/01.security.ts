// Security headers on every answer, and a same-origin check on every state-changing request
// (CSRF): browsers send Origin (or Sec-Fetch-Site) with cross-site POST/PUT/PATCH/DELETE.
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler((event) => {
  setResponseHeaders(event, {
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Referrer-Policy': 'same-origin',
    'Permissions-Policy': 'camera=(), microphone=(), geolocation=(), payment=()',
    'Cross-Origin-Opener-Policy': 'same-origin',
  })
  if (!UNSAFE.has(event.method)) return
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (site && site !== 'same-origin' && site !== 'none') {
    throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
  }
  const origin = getRequestHeader(event, 'origin')
  if (origin && origin !== 'null') {
    const host = getRequestHeader(event, 'x-forwarded-host') && process.env.NUXT_TRUST_PROXY === '1'
      ? getRequestHeader(event, 'x-forwarded-host')
      : getRequestHeader(event, 'host')
    let originHost: string
    try { originHost = new URL(origin).host }
    catch { throw createError({ statusCode: 403, message: 'Cross-site request refused.' }) }
    if (originHost !== host) throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
  }
  else if (origin === 'null') {
    throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
  }
})
