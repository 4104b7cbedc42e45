// Applies migrations before the first request, then seeds the demo when asked to.
export default defineNitroPlugin(async () => {
  runMigrations()
  if (String(useRuntimeConfig().seedDemo) === 'true' || process.env.NUXT_SEED_DEMO === '1') {
    await seedDemo()
  }
})
