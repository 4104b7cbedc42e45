import type { LiveEvent, ResponseData } from '~~/shared/live/types'

export interface OutgoingResponse {
  injectKey: string
  choice: string | null
  text: string
  /** The inject's revision on screen when the team answered. */
  injectRevision?: number
  idempotencyKey: string
  queuedAt: number
}
export type SubmitResult = { state: 'sent'; response: ResponseData } | { state: 'queued' }

const flushing = new Set<string>()

/**
 * A team's responses on their way to the server. One that cannot be sent (offline, no answer) waits
 * in a queue kept in localStorage and goes out, with its idempotency key, when the connection is
 * back: a retry never records it twice, and a reload does not lose it.
 */
export function useResponseOutbox(exerciseId: string) {
  const queue = useState<OutgoingResponse[]>(`outbox-${exerciseId}`, () => [])
  /** Queued responses the server refused when they went out (e.g. the exercise had ended), with why. */
  const refused = useState<Array<OutgoingResponse & { reason: string }>>(`outbox-refused-${exerciseId}`, () => [])
  const storageKey = `bw-outbox:${exerciseId}`

  function save() {
    try { localStorage.setItem(storageKey, JSON.stringify(queue.value)) }
    catch { /* private mode or full: the queue still lives in memory */ }
  }
  function load() {
    try {
      const kept = JSON.parse(localStorage.getItem(storageKey) ?? '[]') as OutgoingResponse[]
      const known = new Set(queue.value.map(q => q.idempotencyKey))
      queue.value = [...queue.value, ...kept.filter(q => !known.has(q.idempotencyKey))]
    }
    catch { /* nothing kept */ }
  }
  function drop(key: string) {
    queue.value = queue.value.filter(q => q.idempotencyKey !== key)
    save()
  }

  const post = (
    r: Omit<OutgoingResponse,
      'queuedAt'>,
  ) => $fetch<{ event: LiveEvent<'response.submitted'> | null }>(`/api/exercises/${exerciseId}/responses`, {
    method: 'POST', body: {
      injectKey: r.injectKey,
      choice: r.choice || null,
      text: r.text,
      injectRevision: r.injectRevision,
      idempotencyKey: r.idempotencyKey,
    }, timeout: 15_000,
  })

  /** Sends a response now, or queues it when the server cannot be reached; a refusal (4xx) is thrown. */
  async function submit(r: Omit<OutgoingResponse, 'queuedAt'>): Promise<SubmitResult> {
    const enqueue = (): SubmitResult => {
      if (!queue.value.some(q => q.idempotencyKey === r.idempotencyKey)) queue.value = [...queue.value, { ...r, queuedAt: Date.now() }]
      save()
      return { state: 'queued' }
    }
    if (import.meta.client && navigator.onLine === false) return enqueue()
    try {
      const res = await post(r)
      return { state: 'sent', response: res.event!.data }
    }
    catch (e) {
      if (isNetworkFailure(e)) return enqueue()
      throw e
    }
  }

  /** Sends what waits, oldest first; stops at the first that still cannot reach the server. */
  async function flush() {
    if (flushing.has(exerciseId) || !queue.value.length) return
    flushing.add(exerciseId)
    try {
      for (const item of [...queue.value]) {
        try {
          await post(item)
          drop(item.idempotencyKey)
        }
        catch (e) {
          if (isNetworkFailure(e)) break
          refused.value = [...refused.value, { ...item, reason: failureText(e) }]
          drop(item.idempotencyKey)
        }
      }
    }
    finally { flushing.delete(exerciseId) }
  }

  return { queue, refused, submit, flush, load }
}
