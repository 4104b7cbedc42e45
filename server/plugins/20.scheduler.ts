// The inject scheduler: every SCHEDULER_INTERVAL_MS it releases what fell due in running exercises.
// The first pass also covers paused ones, so what fell due while the server was down goes out once.
const SCHEDULER_INTERVAL_MS = Number(process.env.NUXT_SCHEDULER_INTERVAL_MS) || 250

export default defineNitroPlugin((nitroApp) => {
  const first = setTimeout(() => schedulerTick(['running', 'paused']), 0)
  const timer = setInterval(() => schedulerTick(['running']), SCHEDULER_INTERVAL_MS)
  nitroApp.hooks.hook('close', () => {
    clearTimeout(first)
    clearInterval(timer)
  })
})
