import { createHash, randomBytes } from 'node:crypto'
import { and, eq, isNull } from 'drizzle-orm'

const LIFETIME_MS = { invite: 72 * 3600_000, reset: 3600_000 } as const
type TokenKind = keyof typeof LIFETIME_MS

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')

/** Issues a single-use token (32 random bytes, base64url); earlier unused ones of the kind are voided. */
export function issueAccountToken(userId: string, kind: TokenKind, now = Date.now()): string {
  const token = randomBytes(32).toString('base64url')
  const db = useDB()
  db.transaction((tx) => {
    tx.update(schema.accountTokens).set({ usedAt: new Date(now) })
      .where(and(eq(schema.accountTokens.userId, userId), eq(schema.accountTokens.kind, kind), isNull(schema.accountTokens.usedAt))).run()
    tx.insert(schema.accountTokens).values({
      userId,
      kind,
      tokenHash: hashToken(token),
      expiresAt: new Date(now + LIFETIME_MS[kind]),
    }).run()
  })
  return token
}

/** Marks a token used and returns its user id; unknown, used or expired → 400 with one message. */
export function consumeAccountToken(token: string, now = Date.now()): { userId: string; kind: TokenKind } {
  const db = useDB()
  return db.transaction((tx) => {
    const row = tx.select().from(schema.accountTokens).where(eq(schema.accountTokens.tokenHash, hashToken(token))).get()
    if (!row || row.usedAt || row.expiresAt.getTime() < now) {
      throw createError({ statusCode: 400, message: 'This link is invalid or has expired. Ask for a new one.' })
    }
    tx.update(schema.accountTokens).set({ usedAt: new Date(now) }).where(eq(schema.accountTokens.id, row.id)).run()
    return { userId: row.userId, kind: row.kind }
  }, { behavior: 'immediate' }) // read then write: take the write lock first (several processes may share the file)
}

/** What stands where an account link's token was, in a stored copy of a mail. */
export const WITHHELD_LINK = '[link withheld: it went to the recipient only]'

/**
 * A mail's text with the tokens of account links (invitation, password reset) taken out: a stored copy (the local
 * mailbox, a backup) must not let whoever reads it set the password of someone else's account.
 */
export function withoutAccountTokens(text: string): string {
  return text.replace(/\/password\/[A-Za-z0-9_-]{16,}(\?[^\s"'<>]*)?/g, `/password/${WITHHELD_LINK}`)
}
