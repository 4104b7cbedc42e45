import type { FieldIssue } from '#shared/utils/issues'

/** A field problem as the server reports it (scenario files add line and column). */
export type ServerIssue = FieldIssue & { line?: number; column?: number }

/** What the app reads from a failed `$fetch`: status (0 when no answer came), the server's message, field issues, extra data. */
export interface FetchFailure {
  status: number
  message: string | null
  issues: ServerIssue[]
  data: Record<string, unknown>
}

/** The one reader of a failed `$fetch` (h3 errors arrive as `{ statusCode, data: { message, data } }`). */
export function readFetchError(e: unknown): FetchFailure {
  const err = e as { statusCode?: number; data?: { message?: string; data?: Record<string, unknown> & { issues?: ServerIssue[] } } } | null
  const data = err?.data?.data ?? {}
  return { status: err?.statusCode ?? 0, message: err?.data?.message ?? null, issues: data.issues ?? [], data }
}

/** The message of a failed `$fetch`, for a person. */
export function failureText(e: unknown, fallback = 'That did not work. Try again.'): string {
  const f = readFetchError(e)
  if (!f.status) return 'No answer from the server: check the connection and try again.'
  return f.message ?? fallback
}
