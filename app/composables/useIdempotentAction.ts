/**
 * A fresh idempotency key: 128 random bits. crypto.getRandomValues also works on a plain-HTTP
 * address (a laptop serving a room over hotel Wi-Fi), where crypto.randomUUID does not exist.
 */
export function newIdempotencyKey(): string {
  const bytes = new Uint8Array(16)
  crypto.getRandomValues(bytes)
  return `bw-${[...bytes].map(b => b.toString(16).padStart(2, '0')).join('')}`
}

/** True when a failed $fetch got no answer from the server (offline, dropped, timed out). */
export function isNetworkFailure(e: unknown): boolean {
  const err = e as { statusCode?: number; response?: unknown } | null
  return !err?.response && !err?.statusCode
}

/**
 * A write that may be retried without doing it twice: one idempotency key per draft, kept until
 * `renew()` (after success); a second call while one is in flight — a double click — joins the first.
 */
export function useIdempotentAction<A, T>(send: (arg: A, idempotencyKey: string) => Promise<T>) {
  const key = ref(newIdempotencyKey())
  const busy = ref(false)
  let inflight: Promise<T> | null = null
  function run(arg: A): Promise<T> {
    if (inflight) return inflight
    busy.value = true
    inflight = send(arg, key.value).finally(() => {
      inflight = null
      busy.value = false
    })
    return inflight
  }
  const renew = () => { key.value = newIdempotencyKey() }
  return { key, busy, run, renew }
}
