import { ServerResponse } from 'node:http'
import type { IncomingMessage } from 'node:http'
import type { Server } from 'socket.io'
import { rooms } from '#shared/live/visibility'

let io: Server | undefined

export function setIO(server: Server): void { io = server }

/** The Socket.IO server of this process (set by server/plugins/socket.io.ts). */
export function useIO(): Server | undefined { return io }

/** Why a member's live sockets were dropped: the page reconnects with the new role, or says it was removed. */
export type MembershipChange = 'removed' | 'changed'

/**
 * Drops every live socket of one member of an exercise, in every process (the Redis adapter carries it): told why
 * first (`live:membership`), then disconnected. Called on every membership change (remove, role, team) so that no
 * socket keeps hearing what its old role or team was sent.
 */
export function dropMemberSockets(exerciseId: string, userId: string, change: MembershipChange): void {
  const room = useIO()?.in(rooms.member(exerciseId, userId))
  if (!room) return
  room.emit('live:membership', { exerciseId, change })
  room.disconnectSockets(true)
}

/** The active user of a raw handshake request's live session cookie (see `liveSessionUser`); null otherwise. */
export async function userFromHandshake(req: IncomingMessage) {
  const event = createEvent(req, new ServerResponse(req))
  return liveSessionUser(await getUserSession(event))
}
