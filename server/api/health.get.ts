import { sql } from 'drizzle-orm'

export default defineEventHandler(() => {
  const row = useDB().get<{ ok: number }>(sql`select 1 as ok`)
  return { status: row?.ok === 1 ? 'ok' : 'degraded', time: new Date().toISOString() }
})
