import type { NitroApp } from 'nitropack'
import { Server as Engine } from 'engine.io'
import { Server } from 'socket.io'
import { eq } from 'drizzle-orm'

// All realtime glue: Socket.IO bound to Nitro's router on /socket.io/ (HTTP long-polling and
// WebSocket upgrades through crossws). Every connection must carry a valid session cookie.
export default defineNitroPlugin((nitroApp: NitroApp) => {
  const engine = new Engine({ pingInterval: 10_000, pingTimeout: 8_000, path: '/socket.io/' } as ConstructorParameters<typeof Engine>[0])
  const io = new Server({ serveClient: false, connectionStateRecovery: undefined })
  io.bind(engine)
  setIO(io)

  io.use(async (socket, next) => {
    try {
      const sessionUser = await userFromHandshake(socket.request)
      const user = sessionUser && useDB().select().from(schema.users).where(eq(schema.users.id, sessionUser.id)).get()
      if (!user || user.disabled) return next(new Error('unauthorized'))
      socket.data.userId = user.id
      socket.data.systemRole = user.systemRole
      next()
    }
    catch {
      next(new Error('unauthorized'))
    }
  })

  io.on('connection', (socket) => {
    socket.join(`user:${socket.data.userId}`)
    socket.emit('hello', { userId: socket.data.userId, serverTime: Date.now() })
    socket.on('ping:clock', (ack: unknown) => {
      if (typeof ack === 'function') ack({ serverTime: Date.now() })
    })
  })

  nitroApp.router.use('/socket.io/', defineEventHandler({
    handler(event) {
      engine.handleRequest(event.node.req, event.node.res)
      event._handled = true
    },
    websocket: {
      open(peer) {
        // crossws >= 0.3: the node request and raw WebSocket are private members.
        // @ts-expect-error private method and property
        engine.prepare(peer._internal.nodeReq)
        // @ts-expect-error private method and property
        engine.onWebSocket(peer._internal.nodeReq, peer._internal.nodeReq.socket, peer.websocket)
      },
    },
  }))

  nitroApp.hooks.hook('close', async () => {
    await io.close()
  })
})
