import { H3Error } from 'h3'
import type { FieldIssue } from '#shared/utils/issues'

/** What went wrong in a service, independent of HTTP. */
export type DomainErrorKind = 'invalid' | 'forbidden' | 'not-found' | 'conflict' | 'ended' | 'too-large'

/** The one place where domain errors become HTTP statuses (an ended drill refuses writes as a conflict). */
export const HTTP_STATUS_OF: Record<DomainErrorKind, number> = {
  'invalid': 400,
  'forbidden': 403,
  'not-found': 404,
  'conflict': 409,
  'ended': 409,
  'too-large': 413,
}

/**
 * A service's refusal. It is an H3Error, so a route that lets it through answers with the mapped
 * status, the message and `data`; code that handles it (the scheduler) reads `kind`, not a status.
 */
export class DomainError extends H3Error<Record<string, unknown> | undefined> {
  readonly kind: DomainErrorKind
  constructor(kind: DomainErrorKind, message: string, data?: Record<string, unknown>) {
    super(message)
    this.kind = kind
    this.statusCode = HTTP_STATUS_OF[kind]
    this.data = data
  }
}

export const isDomainError = (err: unknown, ...kinds: DomainErrorKind[]): err is DomainError =>
  err instanceof DomainError && (kinds.length === 0 || kinds.includes(err.kind))

/** The caller's role does not allow this. */
export const forbidden = (message: string) => new DomainError('forbidden', message)
/** No such thing (or not one the caller may see). */
export const notFound = (message: string) => new DomainError('not-found', message)
/** The thing is in another state than the request assumes (already done, edited meanwhile, taken). */
export const conflict = (message: string, data?: Record<string, unknown>) => new DomainError('conflict', message, data)
/** The drill is over: nothing more is written to its record. */
export const exerciseEnded = () => new DomainError('ended', 'The exercise has ended.')
/** The exercise's record holds as much written text as it may (NUXT_RECORD_LIMIT_MB). */
export const recordFull = (limitMb: number) => new DomainError(
  'too-large',
  `This exercise's record is full: it holds the ${limitMb} MB of written answers, messages and notes a drill may keep. `
  + 'Nothing was saved. Ask the facilitator: the drill goes on, but new text cannot be stored.',
  { code: 'record-full', limitMb },
)
/** A request that names something the service rejects, with a path per problem. */
export const invalidFields = (issues: FieldIssue[], message = 'Invalid request body: check the listed fields.') =>
  new DomainError('invalid', message, { issues })
/** One rejected field. */
export const badField = (path: string, message: string) => invalidFields([{ path, message }])

const lastLogged = new Map<string, number>()
/** Logs an error at most once a minute per key, so that a failing loop (the scheduler's 250 ms tick) cannot flood the log. */
export function logThrottled(key: string, message: string, err: unknown, everyMs = 60_000): void {
  const now = Date.now()
  if (now - (lastLogged.get(key) ?? -Infinity) < everyMs) return
  lastLogged.set(key, now)
  console.error(message, err)
}

/** The SQLite error code behind an error (h3 wraps a thrown error as its `cause`), if any. */
function sqliteCode(err: unknown): string | undefined {
  const e = err as { code?: unknown; cause?: { code?: unknown } } | null
  const code = e?.code ?? e?.cause?.code
  return typeof code === 'string' && code.startsWith('SQLITE_') ? code : undefined
}

/** True for a database that cannot be written: read-only (file, folder or maintenance), full, or failing I/O. */
export function isStorageError(err: unknown): boolean {
  return /^SQLITE_(READONLY|FULL|IOERR|CANTOPEN)/.test(sqliteCode(err) ?? '')
}

/** What a write hears when the database cannot be written. */
export const STORAGE_UNAVAILABLE = 'The database cannot be written just now (read-only, full or failing): nothing was saved. '
  + 'Try again in a few minutes; an administrator has been told in the server log.'
