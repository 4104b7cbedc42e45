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

const JSON_TYPE = /^application\/(?:[\w.-]+\+)?json\s*(?:;|$)/i

/** The JSON body, validated; a malformed or invalid body → 400 with field-level issues, a body that is not JSON → 415. */
export async function readValid<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  const hasBody = Number(getRequestHeader(event, 'content-length') ?? 0) > 0 || !!getRequestHeader(event, 'transfer-encoding')
  if (hasBody && !JSON_TYPE.test(getRequestHeader(event, 'content-type') ?? '')) {
    throw createError({ statusCode: 415, message: 'Send the request body as JSON (Content-Type: application/json).' })
  }
  let body: unknown
  try { body = await readBody(event) }
  catch { throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' }) }
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
