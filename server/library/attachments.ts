import { createHash } from 'node:crypto'
import type { H3Event } from 'h3'

/** Largest attachment accepted, bytes. */
export const MAX_ATTACHMENT_BYTES = 5 * 1024 * 1024

const TEXT_TYPES: Record<string, string> = { md: 'text/markdown', txt: 'text/plain', csv: 'text/csv' }

/**
 * The content type of an upload, decided from its bytes (and, for text, its extension) — never
 * from what the client claims. Null when the type is not allowed.
 */
export function sniffContentType(bytes: Uint8Array, filename: string): string | null {
  const b = bytes
  const starts = (...sig: number[]) => sig.every((v, i) => b[i] === v)
  if (starts(0x25, 0x50, 0x44, 0x46, 0x2d)) return 'application/pdf'
  if (starts(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'image/png'
  if (starts(0xff, 0xd8, 0xff)) return 'image/jpeg'
  if (starts(0x52, 0x49, 0x46, 0x46) && b[8] === 0x57 && b[9] === 0x45 && b[10] === 0x42 && b[11] === 0x50) return 'image/webp'
  const ext = filename.toLowerCase().split('.').pop() ?? ''
  if (TEXT_TYPES[ext] && b.indexOf(0) === -1) {
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(b)
      return TEXT_TYPES[ext]
    }
    catch { return null }
  }
  return null
}

export const ALLOWED_ATTACHMENTS = 'PDF, PNG, JPEG, WebP, Markdown (.md), text (.txt) or CSV'

/** A safe file name: letters, digits, dot, dash and underscore; no path. */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? 'file'
  const cleaned = base.normalize('NFKD').replace(/[^\w.-]+/g, '-').replace(/^[.-]+/, '').slice(0, 120)
  return cleaned || 'file'
}

const storage = () => useStorage('attachments')

/** Stores bytes by their SHA-256 (the same file is kept once) and returns the hash. */
export async function putBlob(bytes: Uint8Array): Promise<string> {
  const sha256 = createHash('sha256').update(bytes).digest('hex')
  const key = `${sha256.slice(0, 2)}:${sha256}`
  if (!(await storage().hasItem(key))) await storage().setItemRaw(key, Buffer.from(bytes))
  return sha256
}

export async function getBlob(sha256: string): Promise<Buffer | null> {
  const raw = await storage().getItemRaw(`${sha256.slice(0, 2)}:${sha256}`)
  return raw ? Buffer.from(raw as Uint8Array) : null
}

/** Sends a stored attachment with headers that keep the browser from running it. */
export async function sendAttachment(event: H3Event, a: { name: string; contentType: string; sha256: string }) {
  const bytes = await getBlob(a.sha256)
  if (!bytes) throw notFound('The file is missing from storage.')
  const inline = a.contentType.startsWith('image/') || a.contentType === 'application/pdf'
  const type = a.contentType.startsWith('text/') ? `${a.contentType}; charset=utf-8` : a.contentType
  setResponseHeaders(event, {
    'Content-Type': type,
    'Content-Length': String(bytes.length),
    'Content-Disposition': `${inline ? 'inline' : 'attachment'}; filename="${safeFileName(a.name)}"`,
    'X-Content-Type-Options': 'nosniff',
    'Content-Security-Policy': 'sandbox; default-src \'none\'; img-src \'self\'; style-src \'unsafe-inline\'',
    'Cache-Control': 'private, max-age=300',
  })
  return bytes
}

/**
 * The parameters of a Content-Disposition header value (`form-data; name="file"; filename="a;b=c.md"`), with quoted
 * strings read whole (RFC 7578 / 2616: `;` and `=` inside quotes belong to the value) and `filename*` (RFC 5987).
 */
export function dispositionParams(value: string): Record<string, string> {
  const out: Record<string, string> = {}
  const re = /;\s*([\w*.-]+)\s*=\s*(?:"((?:[^"\\]|\\.)*)"|([^;]*))/g
  for (let m = re.exec(value); m; m = re.exec(value)) {
    const key = m[1]!.toLowerCase()
    const raw = m[2] !== undefined ? m[2].replace(/\\(.)/g, '$1') : m[3]!.trim()
    if (key === 'filename*') {
      const ext = /^([\w-]+)'[\w-]*'(.*)$/.exec(raw)
      try { out.filename = ext ? decodeURIComponent(ext[2]!) : raw }
      catch { out.filename = raw }
    }
    else if (!(key === 'filename' && out.filename !== undefined)) out[key] = raw
  }
  return out
}

/** The first part named `file` with a file name in a multipart body (binary-safe), or null. */
function fileField(raw: Buffer, boundary: string): { filename: string; data: Buffer } | null {
  const delim = Buffer.from(`--${boundary}`)
  const next = Buffer.from(`\r\n--${boundary}`)
  let pos = raw.indexOf(delim)
  while (pos >= 0) {
    const start = pos + delim.length
    if (raw[start] === 45 && raw[start + 1] === 45) return null
    const headEnd = raw.indexOf('\r\n\r\n', start)
    if (headEnd < 0) return null
    const end = raw.indexOf(next, headEnd + 4)
    if (end < 0) return null
    const head = raw.subarray(start, headEnd).toString('latin1')
    const line = head.split('\r\n').find(l => /^content-disposition\s*:/i.test(l))
    // Browsers send file names as UTF-8 bytes inside the quotes.
    const params = line ? dispositionParams(Buffer.from(line.replace(/^[^:]*:/, ''), 'latin1').toString('utf8')) : {}
    if (params.name === 'file' && params.filename !== undefined) return { filename: params.filename, data: raw.subarray(headEnd + 4, end) }
    pos = end + 2
  }
  return null
}

/**
 * Reads one file from a multipart body after checking the declared length, so an oversized upload is refused before
 * it is read (and a chunked one at the body limit). Field name `file`; any file name is accepted (callers store a
 * sanitised copy for paths and downloads).
 */
export async function readUpload(event: H3Event, maxBytes: number, what: string) {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > maxBytes + 64 * 1024) {
    throw createError({ statusCode: 413, message: `The ${what} is too large (limit ${Math.round(maxBytes / 1024)} KiB).` })
  }
  const noFile = () => createError({
    statusCode: 400,
    message: 'Send the file as multipart/form-data in a field named "file".',
    data: { issues: [{ path: 'file', message: 'Choose a file.' }] },
  })
  const boundary = /boundary=(?:"([^"]+)"|([^;\s]+))/i.exec(getRequestHeader(event, 'content-type') ?? '')
  if (!boundary) throw noFile()
  let raw: Buffer | undefined
  try { raw = await readRawBody(event, false) }
  catch (e) {
    if (isBodyLimitError(e)) throw e
    throw noFile()
  }
  const file = raw ? fileField(raw, boundary[1] ?? boundary[2]!) : null
  if (!file) throw noFile()
  if (file.data.length > maxBytes) {
    throw createError({ statusCode: 413, message: `The ${what} is too large (limit ${Math.round(maxBytes / 1024)} KiB).` })
  }
  if (file.data.length === 0) throw createError({
    statusCode: 400,
    message: `The ${what} is empty.`,
    data: { issues: [{ path: 'file', message: 'The file is empty.' }] },
  })
  return { filename: file.filename || 'file', data: new Uint8Array(file.data) }
}
