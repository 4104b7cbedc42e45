import { afterEach, describe, expect, it } from 'vitest'
import { io, type Socket } from 'socket.io-client'
import { as, baseUrl } from '../support/client'

const sockets: Socket[] = []
afterEach(() => { while (sockets.length) sockets.pop()!.close() })

function connect(cookie?: string, transports: Array<'websocket' | 'polling'> = ['websocket']) {
  const s = io(baseUrl(), { path: '/socket.io/', transports, reconnection: false, extraHeaders: cookie ? { cookie } : {}, timeout: 5000 })
  sockets.push(s)
  return s
}

describe('realtime connection', () => {
  for (const transport of ['websocket', 'polling'] as const) {
    it(`a signed-in client connects over ${transport} and the server answers its clock ping`, async () => {
      const c = await as('science')
      const s = connect(c.cookieHeader, [transport])
      await new Promise<void>((ok, fail) => {
        s.on('connect', () => ok())
        s.on('connect_error', fail)
      })
      const before = Date.now()
      const pong = await s.timeout(5000).emitWithAck('ping:clock') as { serverTime: number }
      expect(pong.serverTime).toBeGreaterThanOrEqual(before - 1000)
      expect(pong.serverTime).toBeLessThanOrEqual(Date.now() + 1000)
    })
  }

  it('an anonymous client is refused', async () => {
    const s = connect()
    const err = await new Promise<Error>((ok, fail) => {
      s.on('connect', () => fail(new Error('connected anonymously')))
      s.on('connect_error', ok)
    })
    expect(err.message).toBe('unauthorized')
  })

  it('a forged cookie is refused', async () => {
    const s = connect('brinkwater-session=Fe26.2**forged')
    const err = await new Promise<Error>((ok, fail) => {
      s.on('connect', () => fail(new Error('connected with a forged cookie')))
      s.on('connect_error', ok)
    })
    expect(err.message).toBe('unauthorized')
  })
})
