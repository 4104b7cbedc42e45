import { randomUUID } from 'node:crypto'
import { createReadStream } from 'node:fs'
import { mkdtemp, rm, stat } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import Database from 'better-sqlite3'

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
  // The copy names a new epoch of the record: restored, it tells open pages to replay from scratch. It holds no working
  // account link: pending invitations and resets are left out (a restored copy sends new ones), and stored mails lose
  // their links' tokens.
  const copy = new Database(file)
  try {
    // Overwrite what is deleted or replaced, so that no old page of the file still holds a link.
    copy.pragma('secure_delete = ON')
    copy.transaction(() => {
      copy.prepare(`INSERT OR REPLACE INTO app_meta (key, value) VALUES ('epoch', ?)`).run(randomUUID())
      copy.prepare('DELETE FROM account_tokens').run()
      const update = copy.prepare('UPDATE caught_mail SET text = ?, html = ? WHERE id = ?')
      const mails = copy.prepare(`SELECT id, text, html FROM caught_mail WHERE text LIKE '%/password/%' OR html LIKE '%/password/%'`)
        .all() as Array<{ id: string; text: string; html: string | null }>
      for (const m of mails) update.run(withoutAccountTokens(m.text), m.html === null ? null : withoutAccountTokens(m.html), m.id)
    })()
  }
  finally { copy.close() }
  // The client left while the copy was being taken.
  if (event.node.res.destroyed || event.node.req.destroyed) {
    await rm(dir, { recursive: true, force: true })
    return null
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
  const cleanup = () => { void rm(dir, { recursive: true, force: true }) }
  stream.on('close', cleanup)
  // A download the client gives up on leaves a paused stream that never closes by itself: end it with the response.
  event.node.res.once('close', () => {
    stream.destroy()
    cleanup()
  })
  return sendStream(event, stream)
})
