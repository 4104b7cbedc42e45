// Request bodies stop at the limit whatever their framing: a chunked body declares no length, and used to be read
// whole (three anonymous 200 MiB posts took the server from 0.4 to 1.9 GB). Own server, so that its memory can be read.
import { readFileSync } from 'node:fs'
import { request } from 'node:http'
import { connect } from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO } from '../support/client'
import { Http, TestServer } from '../support/test-server'

let server: TestServer

beforeAll(async () => {
  server = await new TestServer({ stderr: 'ignore' }).init()
  await server.start()
}, 90_000)
afterAll(async () => { await server?.dispose() })

/** Resident memory of the server process, MiB (Linux). */
function rssMiB(): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${server.pid}/status`, 'utf8'))
  return m ? Number(m[1]) / 1024 : NaN
}

/**
 * Posts `totalMiB` of body in 1 MiB chunks with chunked transfer encoding (no Content-Length), over a raw socket, and
 * stops sending as soon as the server answers. Resolves with the status and how much was sent before the answer. A raw
 * socket reads the answer even when the server closes the connection under a write still going out (EPIPE), which
 * an HTTP client request reports as an error instead of the answer.
 */
function postChunked(path: string, totalMiB: number, headers: Record<string, string>): Promise<{ status: number; sentMiB: number }> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, server.base)
    const sock = connect(Number(url.port), url.hostname)
    const chunk = Buffer.alloc(1024 * 1024, 'a')
    const frame = Buffer.concat([Buffer.from(`${chunk.length.toString(16)}\r\n`), chunk, Buffer.from('\r\n')])
    let sent = 0
    let status = 0
    let heard = ''
    sock.on('data', (d: Buffer) => {
      heard += d.toString('latin1')
      const m = /^HTTP\/1\.1 (\d{3})/.exec(heard)
      if (m && !status) {
        status = Number(m[1])
        resolve({ status, sentMiB: sent })
        sock.destroy()
      }
    })
    sock.on('error', (e) => { setTimeout(() => { if (!status) reject(e) }, 1000) })
    sock.on('close', () => { setTimeout(() => { if (!status) reject(new Error('closed without an answer')) }, 1000) })
    sock.on('connect', () => {
      const head = [`POST ${url.pathname}${url.search} HTTP/1.1`, `Host: ${url.host}`, 'Transfer-Encoding: chunked',
        ...Object.entries(headers).map(([k, v]) => `${k}: ${v}`), '', ''].join('\r\n')
      sock.write(head)
      const pump = () => {
        while (!status && sent < totalMiB && !sock.destroyed) {
          sent++
          if (!sock.write(frame)) { sock.once('drain', pump); return }
        }
        if (!status && !sock.destroyed) sock.write('0\r\n\r\n')
      }
      pump()
    })
  })
}

describe('request bodies stop at the limit whatever the framing', () => {
  it('answers a chunked oversize JSON body with 413 after at most the limit, and the server\'s memory stays bounded', async () => {
    const before = rssMiB()
    for (let k = 0; k < 3; k++) {
      const r = await postChunked('/api/auth/forgot', 200, { 'content-type': 'application/json' })
      expect(r.status).toBe(413)
      // The answer comes once the 6 MiB limit is passed, long before the 200 MiB are sent.
      expect(r.sentMiB).toBeLessThan(200)
    }
    expect(rssMiB() - before).toBeLessThan(100)
    expect((await fetch(`${server.base}/api/health`)).ok).toBe(true)
  }, 120_000)

  it('answers a 64 MiB body with 413, not 400, with or without a declared length', async () => {
    const big = `{"email":"${'x'.repeat(64 * 1024 * 1024)}"}`
    const declared = await fetch(`${server.base}/api/auth/forgot`, { method: 'POST', body: big, headers: { 'content-type': 'application/json' } })
      .then(r => r.status).catch(() => 413)
    expect(declared).toBe(413)
    expect((await postChunked('/api/auth/forgot', 64, { 'content-type': 'application/json' })).status).toBe(413)
  }, 60_000)

  it('still reads a chunked body under the limit (a sign-in sent in chunks works)', async () => {
    const body = JSON.stringify({ email: DEMO.facilitator, password: 'brinkwater-demo' })
    const status = await new Promise<number>((resolve, reject) => {
      const req = request(new URL('/api/auth/login', server.base), {
        method: 'POST', headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked' },
      })
      req.on('response', (res) => { res.resume(); resolve(res.statusCode ?? 0) })
      req.on('error', reject)
      req.write(body.slice(0, 10))
      req.end(body.slice(10))
    })
    expect(status).toBe(200)
  })

  it('stops a chunked multipart upload at the limit too (scenario import, as a facilitator)', async () => {
    const http = new Http(server.base)
    const login = await http.call('POST', '/api/auth/login', { email: DEMO.facilitator, password: 'brinkwater-demo' })
    expect(login.status).toBe(200)
    const r = await postChunked('/api/scenarios/import', 64, {
      'content-type': 'multipart/form-data; boundary=xyz', 'cookie': http.cookie, 'origin': server.base,
    })
    expect(r.status).toBe(413)
  }, 60_000)
})
