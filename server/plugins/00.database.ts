import fsDriver from 'unstorage/drivers/fs'
import { seedDemo } from '~~/server/library'

// Applies migrations before the first request, mounts attachment storage, then seeds the demo when asked to.
export default defineNitroPlugin(async () => {
  runMigrations()
  const config = serverConfig()
  useStorage().mount('attachments', fsDriver({ base: config.attachmentsDir }))
  if (config.seedDemo) {
    const seeding = seedDemo()
    setStartup(seeding)
    await seeding
  }
})
