import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible'
import type { H3Event } from 'h3'

// Consecutive failed sign-ins: 5 per account and address, 30 per address, each over 15 minutes.
const perAccount = new RateLimiterMemory({ keyPrefix: 'login-acct', points: 5, duration: 15 * 60 })
const perAddress = new RateLimiterMemory({ keyPrefix: 'login-ip', points: 30, duration: 15 * 60 })

const clientAddress = (event: H3Event) => getRequestIP(event, { xForwardedFor: serverConfig().trustProxy }) ?? 'unknown'

function tooMany(event: H3Event, msBeforeNext: number): never {
  const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000))
  setResponseHeader(event, 'Retry-After', seconds)
  throw createError({ statusCode: 429, message: `Too many failed sign-ins. Try again in ${Math.ceil(seconds / 60)} min.` })
}

/** Refuses with 429 and Retry-After while the account or address is locked out. */
export async function assertLoginAllowed(event: H3Event, email: string): Promise<void> {
  const ip = clientAddress(event)
  const [a, b] = await Promise.all([perAccount.get(`${email}|${ip}`), perAddress.get(ip)])
  if (a && a.remainingPoints <= 0) tooMany(event, a.msBeforeNext)
  if (b && b.remainingPoints <= 0) tooMany(event, b.msBeforeNext)
}

export async function recordLoginFailure(event: H3Event, email: string): Promise<void> {
  const ip = clientAddress(event)
  for (const [limiter, key] of [[perAccount, `${email}|${ip}`], [perAddress, ip]] as const) {
    try { await limiter.consume(key) }
    catch (e) { if (!(e instanceof RateLimiterRes)) throw e }
  }
}

export async function recordLoginSuccess(event: H3Event, email: string): Promise<void> {
  await perAccount.delete(`${email}|${clientAddress(event)}`)
}
