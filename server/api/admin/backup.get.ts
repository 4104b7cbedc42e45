import { createReadStream } from 'node:fs'
import { mkdtemp, rm, stat } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

// A consistent copy of the whole database, taken with SQLite's online backup while the app runs.
export default defineEventHandler(async (event) => {
  const admin = await requireAdmin(event)
  const dir = await mkdtemp(join(tmpdir(), 'brinkwater-backup-'))
  const file = join(dir, 'backup.sqlite')
  try { await useSqlite().backup(file) }
  catch (e) {
    await rm(dir, { recursive: true, force: true })
    throw e
  }
  const { size } = await stat(file)
  audit(admin.id, 'admin.backup', null, { size })
  const stamp = new Date().toISOString().replace(/[:.]/g, '-').slice(0, 19)
  setResponseHeaders(event, {
    'Content-Type': 'application/vnd.sqlite3',
    'Content-Length': String(size),
    'Content-Disposition': `attachment; filename="brinkwater-${stamp}Z.sqlite"`,
    'Cache-Control': 'no-store',
  })
  const stream = createReadStream(file)
  stream.on('close', () => { void rm(dir, { recursive: true, force: true }) })
  return sendStream(event, stream)
})
