import type { H3Event } from 'h3'

/** Headers of a file download: its type, its name, never cached. */
export function downloadHeaders(event: H3Event, type: string, filename: string) {
  setResponseHeaders(event, {
    'Content-Type': type,
    'Content-Disposition': `attachment; filename="${filename}"`,
    'Cache-Control': 'no-store',
  })
}
