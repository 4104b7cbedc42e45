import { afterEach, describe, expect, it } from 'vitest'
import { io, type Socket } from 'socket.io-client'
import { as, baseUrl } from './helpers'

const sockets: Socket[] = []
afterEach(() => { while (sockets.length) sockets.pop()!.close() })

function connect(cookie?: string, transports: Array<'websocket' | 'polling'> = ['websocket']) {
  const s = io(baseUrl(), { path: '/socket.io/', transports, reconnection: false, extraHeaders: cookie ? { cookie } : {}, timeout: 5000 })
  sockets.push(s)
  return s
}

describe('realtime connection', () => {
  for (const transport of ['websocket', 'polling'] as const) {
    it(`a signed-in client connects over ${transport} and is greeted with its user id`, async () => {
      const c = await as('science')
      const me = (await c.get('/api/me')).json.user.id
      const s = connect(c.cookieHeader, [transport])
      const hello = await new Promise<{ userId: string }>((ok, fail) => {
        s.on('hello', ok)
        s.on('connect_error', fail)
      })
      expect(hello.userId).toBe(me)
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
