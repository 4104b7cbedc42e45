import { randomUUID } from 'node:crypto'
import { readlinkSync } from 'node:fs'
import { hostname } from 'node:os'
import { and, eq, lte, or, sql } from 'drizzle-orm'

/** Where process ids mean the same process: this host and its pid namespace (containers on one host differ). */
function processSpace(): string {
  try { return `${hostname()}~${readlinkSync('/proc/self/ns/pid').replace(/\D/g, '')}` }
  catch { return hostname() }
}
const SPACE = processSpace()

/** This process as a lease holder: `<host~pid namespace>/<pid>/<random>` (the random part tells a reused pid apart). */
export const LEASE_HOLDER = `${SPACE}/${process.pid}/${randomUUID().slice(0, 8)}`

/** Whether a holder id names a process of this host and pid namespace that is gone (so its lease can be taken at once). */
export function holderIsDead(holder: string): boolean {
  const [space, pid] = holder.split('/')
  if (space !== SPACE || !pid || !/^\d+$/.test(pid)) return false
  if (Number(pid) === process.pid) return holder !== LEASE_HOLDER
  try {
    process.kill(Number(pid), 0)
    return false
  }
  catch (err) {
    return (err as NodeJS.ErrnoException).code === 'ESRCH'
  }
}

export interface LeaseState { name: string; holder: string; expiresAt: number; acquiredAt: number }

/** The current row of a lease, or null. */
export function readLease(name: string): LeaseState | null {
  return useDB().select().from(schema.schedulerLeases).where(eq(schema.schedulerLeases.name, name)).get() ?? null
}

/**
 * Takes or renews the lease `name` for `holder` until now + ttlMs, in one SQLite statement: it
 * succeeds when the lease is free, already ours, expired, or held by a dead process of this host.
 * Returns the lease when `holder` holds it afterwards, else null. Times are wall ms.
 */
export function acquireLease(name: string, ttlMs: number, holder = LEASE_HOLDER, now = Date.now()): LeaseState | null {
  const db = useDB()
  const t = schema.schedulerLeases
  const take = (extra?: ReturnType<typeof eq>) => db.insert(t).values({ name, holder, expiresAt: now + ttlMs, acquiredAt: now })
    .onConflictDoUpdate({
      target: t.name,
      set: {
        holder,
        expiresAt: now + ttlMs,
        acquiredAt: sql`case when ${t.holder} = ${holder} then ${t.acquiredAt} else ${now} end`,
        updatedAt: new Date(now),
      },
      setWhere: or(eq(t.holder, holder), lte(t.expiresAt, now), extra),
    }).returning().get()
  const row = take()
  if (row) return row
  const current = readLease(name)
  // A holder that died on this host (SIGKILL, crash) need not be waited for: take over from exactly that holder.
  if (current && current.holder !== holder && holderIsDead(current.holder)) return take(eq(t.holder, current.holder)) ?? null
  return null
}

/** Gives the lease up (on shutdown), so another process can take it at once. */
export function releaseLease(name: string, holder = LEASE_HOLDER): void {
  useDB().delete(schema.schedulerLeases).where(and(eq(schema.schedulerLeases.name, name), eq(schema.schedulerLeases.holder, holder))).run()
}
