import { dirname, resolve } from 'node:path'

/** The server's settings: runtimeConfig (nuxt.config.ts, overridden by NUXT_* environment variables), read once and typed. */
export interface ServerConfig {
  dbFile: string
  /** Read-only maintenance: the database answers reads and refuses writes (SQLite query_only). */
  dbReadOnly: boolean
  migrationsDir: string
  scenariosDir: string
  attachmentsDir: string
  seedDemo: boolean
  demoPassword: string
  appUrl: string
  /** Served over HTTPS: the session cookie is marked Secure. */
  secureCookies: boolean
  /** Behind a reverse proxy: client address and host come from X-Forwarded-*. */
  trustProxy: boolean
  redisUrl: string
  schedulerIntervalMs: number
  schedulerLeaseMs: number
  /** Worker threads for assessments and PDFs; 0: one fewer than the processors, 1 to 4. */
  workerThreads: number
  /** Writes per person, exercise and minute. */
  writeLimitPerMinute: number
  /** Written text one exercise's record may hold, MB. */
  recordLimitMb: number
  /** Live connections per person and process. */
  socketsPerUser: number
  /** The local mail catcher stores account links whole (demo and tests). */
  mailboxLinks: boolean
}

// NUXT_* values arrive parsed ("1" → 1, "true" → true).
const flag = (v: unknown) => v === true || v === 1 || v === '1' || v === 'true'

let config: ServerConfig | undefined

export function serverConfig(): ServerConfig {
  if (config) return config
  const c = useRuntimeConfig()
  const dbFile = resolve(String(c.dbPath))
  const appUrl = String(c.appUrl)
  config = {
    dbFile,
    dbReadOnly: flag(c.dbReadOnly),
    migrationsDir: resolve(String(c.migrationsDir)),
    scenariosDir: resolve(String(c.scenariosDir)),
    attachmentsDir: resolve(String(c.attachmentsDir || '') || resolve(dirname(dbFile), 'attachments')),
    seedDemo: flag(c.seedDemo),
    // DEMO_PASSWORD: the older name of NUXT_DEMO_PASSWORD, still honoured.
    demoPassword: process.env.DEMO_PASSWORD || String(c.demoPassword),
    appUrl,
    secureCookies: flag(c.secureCookies) || /^https:/i.test(appUrl),
    trustProxy: flag(c.trustProxy),
    redisUrl: String(c.redisUrl || ''),
    schedulerIntervalMs: Number(c.schedulerIntervalMs) || 250,
    schedulerLeaseMs: Number(c.schedulerLeaseMs) || 3000,
    workerThreads: Math.max(0, Math.floor(Number(c.workerThreads) || 0)),
    writeLimitPerMinute: Math.max(1, Math.floor(Number(c.writeLimitPerMinute) || 120)),
    recordLimitMb: Math.max(0.01, Number(c.recordLimitMb) || 16),
    socketsPerUser: Math.max(1, Math.floor(Number(c.socketsPerUser) || 12)),
    mailboxLinks: flag(c.mailboxLinks),
  }
  return config
}
