import { ServerResponse } from 'node:http'
import type { IncomingMessage } from 'node:http'
import type { Server } from 'socket.io'

let io: Server | undefined

export function setIO(server: Server): void { io = server }

/** The Socket.IO server of this process (set by server/plugins/socket.io.ts). */
export function useIO(): Server | undefined { return io }

/** Reads the signed-in user from a raw handshake request's session cookie; null when anonymous. */
export async function userFromHandshake(req: IncomingMessage) {
  const event = createEvent(req, new ServerResponse(req))
  const session = await getUserSession(event)
  return session.user ?? null
}
