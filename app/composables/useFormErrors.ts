import type { z } from 'zod'
import type { FieldIssue } from '~~/shared/utils/issues'
import { fieldIssues } from '~~/shared/utils/issues'

/** Field errors for a form: checked first in the browser with the shared zod schema, then from the server's 400. */
export function useFormErrors() {
  const issues = ref<FieldIssue[]>([])
  const message = ref('')
  function check<S extends z.ZodType>(schema: S, value: unknown): z.output<S> | null {
    const r = schema.safeParse(value)
    issues.value = r.success ? [] : fieldIssues(r.error)
    message.value = r.success ? '' : 'Check the highlighted fields.'
    return r.success ? r.data : null
  }
  function fromError(e: unknown) {
    const err = readFetchError(e)
    issues.value = err.issues
    message.value = err.message ?? (e as Error | null)?.message ?? 'Something went wrong.'
  }
  function reset() { issues.value = []; message.value = '' }
  return { issues, message, check, fromError, reset }
}
