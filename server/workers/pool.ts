// The worker entry's URL module is declared there; every TypeScript project that reaches this file needs it.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="./virtual.d.ts" />
import { availableParallelism } from 'node:os'
import { Worker } from 'node:worker_threads'
import workerUrl from 'brinkwater-worker:entry'
import { pdfFonts } from '../review/pdf'
import type { TaskInput, TaskKind, TaskOutput } from './tasks'

/** How long one task may run before its worker is stopped and the request fails (a runaway layout, a stuck loop). */
const TASK_TIMEOUT_MS = { assess: 60_000, report: 120_000, cards: 120_000 } satisfies Record<TaskKind, number>
/** Tasks waiting beyond this many per worker are refused with 503: the server says it is busy rather than queueing for minutes. */
const QUEUE_PER_WORKER = 16

interface Job {
  id: number
  kind: TaskKind
  input: unknown
  resolve: (out: unknown) => void
  reject: (err: Error) => void
}
interface Slot { worker: Worker; job: Job | null; timer: NodeJS.Timeout | null; startedAt: number }

let nextId = 1
let slots: Slot[] = []
const queue: Job[] = []
let size = 0

/** Worker threads: NUXT_WORKER_THREADS, or one fewer than the processors (at least one, at most four). */
function poolSize(): number {
  return serverConfig().workerThreads || Math.max(1, Math.min(4, availableParallelism() - 1))
}

async function spawn(): Promise<Slot> {
  const fonts = await pdfFonts()
  // The entry's URL is read only now: it depends on the server entry having run (see server/build/worker-chunks.ts).
  const worker = new Worker(new URL(workerUrl()), { workerData: { fonts } })
  // Idle workers do not keep the process alive; a busy one is waited for through its job's promise.
  worker.unref()
  const slot: Slot = { worker, job: null, timer: null, startedAt: Date.now() }
  worker.on('message', (msg: { id: number; ok: boolean; output?: unknown; error?: { message: string } }) => {
    const job = slot.job
    if (!job || job.id !== msg.id) return
    finish(slot)
    // A Buffer crosses threads as a plain Uint8Array.
    const out = msg.output instanceof Uint8Array ? Buffer.from(msg.output.buffer, msg.output.byteOffset, msg.output.byteLength) : msg.output
    if (msg.ok) job.resolve(out)
    else job.reject(new Error(msg.error?.message ?? 'worker task failed'))
    pump()
  })
  worker.on('error', (err: Error) => fail(slot, err))
  worker.on('exit', code => fail(slot, new Error(`worker thread stopped (exit code ${code})`)))
  return slot
}

function finish(slot: Slot) {
  if (slot.timer) clearTimeout(slot.timer)
  slot.timer = null
  slot.job = null
}

/**
 * A worker that died or was stopped fails its job; a fresh one takes its place (after a second when it died young,
 * so that a worker that cannot start does not restart in a tight loop).
 */
function fail(slot: Slot, err: Error) {
  if (!slots.includes(slot)) return
  slots = slots.filter(s => s !== slot)
  const job = slot.job
  finish(slot)
  job?.reject(err)
  void slot.worker.terminate()
  const young = Date.now() - slot.startedAt < 1000
  if (young) logThrottled('workers:start', '[workers] a worker thread stopped right after it started (repeats are logged once a minute):', err)
  setTimeout(() => { if (size) void grow().then(pump).catch(() => {}) }, young ? 1000 : 0)
}

let growing: Promise<void> | null = null
function grow(): Promise<void> {
  growing ??= (async () => {
    size ||= poolSize()
    while (slots.length < size) slots.push(await spawn())
  })().finally(() => { growing = null })
  return growing
}

function pump() {
  for (const slot of slots) {
    if (slot.job) continue
    const job = queue.shift()
    if (!job) return
    slot.job = job
    slot.worker.ref()
    slot.timer = setTimeout(() => fail(slot, new Error(`${job.kind} took longer than ${TASK_TIMEOUT_MS[job.kind] / 1000} s`)), TASK_TIMEOUT_MS[job.kind])
    slot.worker.postMessage({ id: job.id, kind: job.kind, input: job.input })
  }
  for (const slot of slots) if (!slot.job) slot.worker.unref()
}

/**
 * Runs a task (tasks.ts) on the pool of worker threads, so that a hazard assessment or a PDF never holds
 * the event loop that serves requests and sockets. Inputs and outputs are copied between threads (plain
 * data; PDFs come back as Buffers). A full queue refuses with 503.
 */
export async function runTask<K extends TaskKind>(kind: K, input: TaskInput<K>): Promise<TaskOutput<K>> {
  if (queue.length >= QUEUE_PER_WORKER * Math.max(1, size || poolSize())) {
    throw createError({ statusCode: 503, statusMessage: 'Busy', message: 'The server is busy with other reports and assessments; try again in a minute.' })
  }
  await grow()
  const out = new Promise<unknown>((resolve, reject) => queue.push({ id: nextId++, kind, input, resolve, reject }))
  pump()
  return out as Promise<TaskOutput<K>>
}

/** Starts the worker threads ahead of the first task (server start), so that no request pays for their start. */
export function warmWorkers(): Promise<void> {
  return grow()
}

/** Stops the worker threads (server shutdown, tests). */
export async function closeWorkers(): Promise<void> {
  const all = slots
  slots = []
  size = 0
  await Promise.all(all.map(s => s.worker.terminate()))
}
