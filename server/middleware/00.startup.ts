// Requests that arrive while the demo seed is still running wait for it, so that the first
// sign-in after a start (or a health check) never sees a half-seeded database.
export default defineEventHandler(async () => {
  await startupDone()
})
