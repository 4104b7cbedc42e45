// A database that cannot be written (read-only, full, failing disk) answers writes with a clear 503, logged once a
// minute, instead of a bare 500 per request.
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('error', (error) => {
    if (!isStorageError(error)) return
    logThrottled('storage', '[db] the database cannot be written (repeats are logged once a minute):', error)
    const e = error as Error & { statusCode?: number; statusMessage?: string; unhandled?: boolean; fatal?: boolean }
    e.statusCode = 503
    e.statusMessage = 'Service Unavailable'
    e.message = STORAGE_UNAVAILABLE
    e.unhandled = false
    e.fatal = false
  })
})
