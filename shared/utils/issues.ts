import type { z } from 'zod'

export interface FieldIssue { path: string; message: string }

/** Formats a zod issue path as `injects[4].teams[0]`. */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  return path.reduce<string>((acc, key) => typeof key === 'number'
    ? `${acc}[${key}]`
    : acc ? `${acc}.${String(key)}` : String(key), '')
}

/** Turns a zod error into field-level issues for the client. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map(i => ({ path: formatPath(i.path), message: i.message }))
}
