import pdfmake from 'pdfmake'
import type { TDocumentDefinitions } from 'pdfmake/interfaces'

/** The fonts the PDFs embed (IBM Plex under the SIL OFL, shipped in server/assets/fonts). */
export const PDF_FONT_FILES = [
  'plex-sans-400.woff',
  'plex-sans-400-italic.woff',
  'plex-sans-600.woff',
  'plex-sans-600-italic.woff',
  'plex-mono-400.woff',
] as const
export type PdfFonts = Record<(typeof PDF_FONT_FILES)[number], Uint8Array>

// @types/pdfmake does not describe 0.3's virtual file system.
const vfs = (pdfmake as unknown as { virtualfs: { writeFileSync(name: string, data: Buffer): void } }).virtualfs
let installed = false

/** Gives pdfmake the fonts (once per thread) and forbids documents to fetch anything. */
export function installPdfFonts(fonts: PdfFonts): void {
  if (installed) return
  for (const name of PDF_FONT_FILES) vfs.writeFileSync(name, Buffer.from(fonts[name]))
  pdfmake.setFonts({
    Plex: {
      normal: 'plex-sans-400.woff',
      bold: 'plex-sans-600.woff',
      italics: 'plex-sans-400-italic.woff',
      bolditalics: 'plex-sans-600-italic.woff',
    },
    PlexMono: {
      normal: 'plex-mono-400.woff',
      bold: 'plex-mono-400.woff',
      italics: 'plex-mono-400.woff',
      bolditalics: 'plex-mono-400.woff',
    },
  })
  // Documents never fetch anything: no URLs, no local files beyond the fonts above.
  pdfmake.setUrlAccessPolicy(() => false)
  pdfmake.setLocalAccessPolicy(() => false)
  installed = true
}

/** Renders a pdfmake document definition to PDF bytes (fonts installed first). Runs in a worker thread. */
export async function renderDocument(doc: TDocumentDefinitions): Promise<Buffer> {
  if (!installed) throw new Error('PDF fonts are not installed in this thread')
  const out = pdfmake.createPdf({ ...doc, defaultStyle: { font: 'Plex', fontSize: 10, ...doc.defaultStyle } })
  return Buffer.from(await out.getBuffer())
}
