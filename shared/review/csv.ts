/**
 * CSV cells that a spreadsheet would run as a formula start with = + - @ (or a tab or carriage
 * return before one). Prefixing a single quote makes them plain text (OWASP "CSV Injection";
 * common practice, no source).
 */
export function guardCsvCell(value: unknown): string {
  if (value === null || value === undefined) return ''
  const text = typeof value === 'string' ? value : typeof value === 'object' ? JSON.stringify(value) : String(value)
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text
}
