// A worker thread of the pool (pool.ts): set up once, then one task per message, answered by id.
import { parentPort, workerData } from 'node:worker_threads'
import { setUpWorker, TASKS, type TaskKind, type WorkerSetup } from './tasks'

setUpWorker(workerData as WorkerSetup)
parentPort!.on('message', async (msg: { id: number; kind: TaskKind; input: never }) => {
  try {
    const output = await TASKS[msg.kind](msg.input)
    parentPort!.postMessage({ id: msg.id, ok: true, output })
  }
  catch (err) {
    const e = err as Error
    parentPort!.postMessage({ id: msg.id, ok: false, error: { message: e?.message ?? String(err), stack: e?.stack } })
  }
})
