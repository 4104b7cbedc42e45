import { randomUUID } from 'node:crypto'
import { mkdirSync } from 'node:fs'
import { dirname } from 'node:path'
import Database from 'better-sqlite3'
import { drizzle } from 'drizzle-orm/better-sqlite3'
import type { BetterSQLite3Database } from 'drizzle-orm/better-sqlite3'
import { migrate } from 'drizzle-orm/better-sqlite3/migrator'
import * as schema from '../db/schema'

export { schema }
export type DB = BetterSQLite3Database<typeof schema>
/** A Drizzle transaction on the one SQLite connection. */
export type Tx = Parameters<Parameters<DB['transaction']>[0]>[0]

let sqlite: Database.Database | undefined
let db: DB | undefined

/**
 * The one SQLite connection of this process (better-sqlite3, synchronous).
 * WAL lets readers run beside the writer; synchronous=NORMAL in WAL keeps every committed
 * transaction across a process crash (only an OS crash or power loss can drop the last ones).
 */
export function useDB(): DB {
  if (db) return db
  const file = serverConfig().dbFile
  mkdirSync(dirname(file), { recursive: true })
  sqlite = new Database(file)
  sqlite.pragma('journal_mode = WAL')
  sqlite.pragma('synchronous = NORMAL')
  sqlite.pragma('foreign_keys = ON')
  sqlite.pragma('busy_timeout = 5000')
  db = drizzle(sqlite, { schema })
  return db
}

/** The raw connection, for transactions and the online backup. */
export function useSqlite(): Database.Database {
  useDB()
  return sqlite!
}

/** Applies the drizzle-kit migrations in `drizzle/` (or NUXT_MIGRATIONS_DIR), and gives the record an epoch if it has none. */
export function runMigrations(): void {
  migrate(useDB(), { migrationsFolder: serverConfig().migrationsDir })
  useSqlite().prepare(`INSERT OR IGNORE INTO app_meta (key, value) VALUES ('epoch', ?)`).run(randomUUID())
  if (serverConfig().dbReadOnly) useSqlite().pragma('query_only = ON')
}

/**
 * Whether the database takes writes now: rewrites the header's user_version with its own value (a real write, of
 * nothing). Null when it does; otherwise the SQLite error code (read-only file or folder, disk full, I/O error).
 */
export function writeProbe(): string | null {
  const db = useSqlite()
  try {
    const v = Number(db.pragma('user_version', { simple: true })) || 0
    db.pragma(`user_version = ${v}`)
    return null
  }
  catch (e) { return (e as { code?: string }).code ?? 'SQLITE_ERROR' }
}

/**
 * The epoch of the event record: the same for every process on this file, changed in every backup copy (see the
 * backup route), so that pages that followed the live database notice a restore — where sequence numbers start over
 * from the backup's — and replay from scratch.
 */
export function recordEpoch(): string {
  const row = useSqlite().prepare(`SELECT value FROM app_meta WHERE key = 'epoch'`).get() as { value: string } | undefined
  return row?.value ?? ''
}
