import { io } from 'socket.io-client'
import type { Socket } from 'socket.io-client'

let socket: Socket | null = null
const connected = ref(false)
const lastError = ref<string | null>(null)

/**
 * The one client-side Socket.IO connection (same origin, session cookie). Client-only: on the
 * server it returns nulls. Components register handlers with `on` and they are removed on unmount.
 */
export function useSocket(auth: Record<string, unknown> = {}) {
  if (import.meta.server) return { socket: null, connected, lastError, on: () => {} }
  if (!socket) {
    socket = io({ path: '/socket.io/', auth, transports: ['websocket', 'polling'] })
    socket.on('connect', () => { connected.value = true; lastError.value = null })
    socket.on('disconnect', () => { connected.value = false })
    socket.on('connect_error', (err) => { connected.value = false; lastError.value = err.message })
  }
  const s = socket
  function on(name: string, handler: Parameters<Socket['on']>[1]) {
    s.on(name, handler)
    if (getCurrentInstance()) onBeforeUnmount(() => s.off(name, handler))
  }
  return { socket: s, connected, lastError, on }
}
