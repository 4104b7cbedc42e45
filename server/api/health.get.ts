import { sql } from 'drizzle-orm'

// Liveness and storage: `ok` when the database reads and takes writes; `degraded` (503) when it only reads.
export default defineEventHandler((event) => {
  const row = useDB().get<{ ok: number }>(sql`select 1 as ok`)
  const writeError = writeProbe()
  const ok = row?.ok === 1 && !writeError
  if (!ok) setResponseStatus(event, 503)
  return {
    status: ok ? 'ok' : 'degraded',
    time: new Date().toISOString(),
    ...(writeError ? { database: `cannot be written (${writeError})` } : {}),
  }
})
