import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible'
import type { H3Event } from 'h3'

// Sign-in attempts: 5 per account and address, 30 per address, each over 15 minutes. A point is taken BEFORE the
// password is checked (so parallel guesses cannot all get a check), and given back when the sign-in succeeds (so a
// room of forty people behind one address can all sign in).
const perAccount = new RateLimiterMemory({ keyPrefix: 'login-acct', points: 5, duration: 15 * 60 })
const perAddress = new RateLimiterMemory({ keyPrefix: 'login-ip', points: 30, duration: 15 * 60 })

/**
 * The client's address. Behind a trusted proxy (NUXT_TRUST_PROXY=1) it is the right-most X-Forwarded-For entry, the
 * one the proxy itself added; everything left of it was sent by the client and may be forged.
 */
export function clientAddress(event: H3Event): string {
  if (serverConfig().trustProxy) {
    const added = String(getRequestHeader(event, 'x-forwarded-for') ?? '').split(',').map(s => s.trim()).filter(Boolean).at(-1)
    if (added) return added
  }
  return event.node.req.socket?.remoteAddress ?? 'unknown'
}

function tooMany(event: H3Event, msBeforeNext: number): never {
  const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000))
  setResponseHeader(event, 'Retry-After', seconds)
  throw createError({ statusCode: 429, message: `Too many failed sign-ins. Try again in ${Math.ceil(seconds / 60)} min.` })
}

/** Takes one sign-in attempt for the account and the address, or refuses with 429 and Retry-After when none is left. */
export async function consumeLoginAttempt(event: H3Event, email: string): Promise<void> {
  const ip = clientAddress(event)
  for (const [limiter, key] of [[perAccount, `${email}|${ip}`], [perAddress, ip]] as const) {
    try { await limiter.consume(key) }
    catch (e) {
      if (e instanceof RateLimiterRes) tooMany(event, e.msBeforeNext)
      throw e
    }
  }
}

/** A successful sign-in clears the account's failures and gives the address its point back. */
export async function recordLoginSuccess(event: H3Event, email: string): Promise<void> {
  const ip = clientAddress(event)
  await perAccount.delete(`${email}|${ip}`)
  await perAddress.reward(ip, 1)
}

// Password-reset requests: 3 mails per account an hour (each new link voids the last, so more only annoy), 100 requests
// per address an hour (a brake on mass mailing). Over a limit the answer stays the same 202, and no mail is sent.
const resetPerAccount = new RateLimiterMemory({ keyPrefix: 'reset-acct', points: 3, duration: 60 * 60 })
const resetPerAddress = new RateLimiterMemory({ keyPrefix: 'reset-ip', points: 100, duration: 60 * 60 })

/** Whether a reset mail may go out for this address and account now (takes a point from both). */
export async function resetAllowed(event: H3Event, email: string): Promise<boolean> {
  for (const [limiter, key] of [[resetPerAddress, clientAddress(event)], [resetPerAccount, email]] as const) {
    try { await limiter.consume(key) }
    catch (e) {
      if (e instanceof RateLimiterRes) return false
      throw e
    }
  }
  return true
}

// Writes to a drill: a person may write writeLimitPerMinute times a minute to one exercise (NUXT_WRITE_LIMIT_PER_MINUTE,
// 120: far above what a team, an evaluator or the facilitator does by hand; a script posting answers in a loop stops here).
let drillWrites: RateLimiterMemory | undefined

/** Takes one write for this person and exercise, or refuses with 429 and Retry-After. */
export async function consumeDrillWrite(event: H3Event, userId: string, exerciseId: string): Promise<void> {
  const points = serverConfig().writeLimitPerMinute
  drillWrites ??= new RateLimiterMemory({ keyPrefix: 'drill-write', points, duration: 60 })
  try { await drillWrites.consume(`${userId}|${exerciseId}`) }
  catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e
    const seconds = Math.max(1, Math.ceil(e.msBeforeNext / 1000))
    setResponseHeader(event, 'Retry-After', seconds)
    throw createError({
      statusCode: 429,
      message: `Too many changes in a minute (${points} per person). Nothing was saved; send it again in ${seconds} s.`,
      data: { code: 'too-many-writes', retryAfterSeconds: seconds },
    })
  }
}
