import type { IncomingMessage } from 'node:http'
import type { H3Event } from 'h3'
import type { z } from 'zod'
import { fieldIssues } from '#shared/utils/issues'

function parseOr400<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const result = schema.safeParse(value)
  if (!result.success) {
    throw createError({
      statusCode: 400,
      message: `Invalid ${what}: check the listed fields.`,
      data: { issues: fieldIssues(result.error) },
    })
  }
  return result.data
}

/** Largest request body read at all: the 5 MiB attachment limit plus room for the multipart envelope. */
export const MAX_BODY_BYTES = 6 * 1024 * 1024
/** Where h3 looks first for a request's raw body (readRawBody, readBody, readMultipartFormData). */
const RAW_BODY = Symbol.for('h3RawBody')

/**
 * Makes every later read of the request body stop at maxBytes, whatever its framing (declared length or chunked): h3
 * reads the body through the promise it finds under its raw-body symbol, and ours keeps at most maxBytes, then rejects
 * with 413 and drops the rest as it arrives (memory stays bounded); the answer closes the connection.
 */
export function limitRequestBody(event: H3Event, maxBytes = MAX_BODY_BYTES): void {
  const req = event.node.req as IncomingMessage & { [RAW_BODY]?: Promise<Buffer> }
  if (req[RAW_BODY]) return
  const declared = Number(req.headers['content-length'] ?? 0)
  if (!declared && !/\bchunked\b/i.test(String(req.headers['transfer-encoding'] ?? ''))) return
  const body = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    let over = false
    req.on('data', (chunk: Buffer) => {
      if (over) return
      size += chunk.length
      if (size <= maxBytes) { chunks.push(chunk); return }
      over = true
      chunks.length = 0
      setResponseHeader(event, 'Connection', 'close')
      reject(createError({ statusCode: 413, message: `The request is too large (limit ${maxBytes / 1024 / 1024} MiB).` }))
    })
    req.on('end', () => { if (!over) resolve(Buffer.concat(chunks)) })
    req.on('error', reject)
  })
  // A handler that never reads the body must not leave an unhandled rejection behind.
  body.catch(() => {})
  req[RAW_BODY] = body
}

/** True for an h3 error that a body read raised on purpose (the size limit), to pass on unchanged. */
export function isBodyLimitError(e: unknown): boolean {
  return typeof e === 'object' && e !== null && (e as { statusCode?: number }).statusCode === 413
}

const JSON_TYPE = /^application\/(?:[\w.-]+\+)?json\s*(?:;|$)/i

/** The JSON body, validated; a malformed or invalid body → 400 with field-level issues, a body that is not JSON → 415. */
export async function readValid<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  const hasBody = Number(getRequestHeader(event, 'content-length') ?? 0) > 0 || !!getRequestHeader(event, 'transfer-encoding')
  if (hasBody && !JSON_TYPE.test(getRequestHeader(event, 'content-type') ?? '')) {
    throw createError({ statusCode: 415, message: 'Send the request body as JSON (Content-Type: application/json).' })
  }
  let body: unknown
  try { body = await readBody(event) }
  catch (e) {
    if (isBodyLimitError(e)) throw e
    throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' })
  }
  return parseOr400(schema, body ?? {}, 'request body')
}

/** Route parameters, validated. */
export function paramsValid<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  return parseOr400(schema, getRouterParams(event, { decode: true }), 'route parameters')
}

/** Query string, validated. */
export function queryValid<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  return parseOr400(schema, getQuery(event), 'query')
}
