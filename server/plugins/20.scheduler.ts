import { scheduleIfHolder, stopScheduling } from '~~/server/live'
import { closeWorkers, warmWorkers } from '~~/server/workers/pool'

// The inject scheduler: every schedulerIntervalMs (NUXT_SCHEDULER_INTERVAL_MS) it releases what fell due in running exercises.
// Several processes may share the database: only the holder of the scheduler lease (a row in
// SQLite, renewed while it runs, taken over after it expires or its process dies) schedules.
// A process that takes the lease first covers paused exercises too, so what fell due while no
// process was scheduling goes out once.
export default defineNitroPlugin((nitroApp) => {
  const { schedulerIntervalMs, schedulerLeaseMs } = serverConfig()
  // A pass lets I/O run between releases, so one may outlast the interval: passes never overlap.
  let busy = false
  const tick = async () => {
    if (busy) return
    busy = true
    try { await scheduleIfHolder(schedulerLeaseMs) }
    catch (err) { logThrottled('scheduler', '[scheduler] (repeats are logged once a minute)', err) }
    finally { busy = false }
  }
  // The worker threads (assessments, PDFs) start now rather than on the first request that needs them.
  // (After the server's modules have all run: the workers' file is found from the server entry.)
  setTimeout(() => warmWorkers().catch(err => console.error('[workers] could not start the worker threads:', err)), 0)
  const first = setTimeout(() => void tick(), 0)
  const timer = setInterval(() => void tick(), schedulerIntervalMs)
  nitroApp.hooks.hook('close', () => {
    clearTimeout(first)
    clearInterval(timer)
    try { stopScheduling() }
    catch (err) { console.error('[scheduler] could not free the lease:', err) }
    return closeWorkers()
  })
})
