import { dirname, resolve } from 'node:path'
import fsDriver from 'unstorage/drivers/fs'
import { seedDemo } from '~~/server/library'

// Applies migrations before the first request, mounts attachment storage, then seeds the demo when asked to.
export default defineNitroPlugin(async () => {
  runMigrations()
  const config = useRuntimeConfig()
  const dbFile = resolve(process.env.NUXT_DB_PATH || config.dbPath)
  const base = resolve(process.env.NUXT_ATTACHMENTS_DIR || config.attachmentsDir || resolve(dirname(dbFile), 'attachments'))
  useStorage().mount('attachments', fsDriver({ base }))
  if (String(config.seedDemo) === 'true' || process.env.NUXT_SEED_DEMO === '1') {
    const seeding = seedDemo()
    setStartup(seeding)
    await seeding
  }
})
