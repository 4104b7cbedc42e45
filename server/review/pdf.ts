import pdfmake from 'pdfmake'
import type { TDocumentDefinitions } from 'pdfmake/interfaces'

const FONT_FILES = [
  'plex-sans-400.woff',
  'plex-sans-400-italic.woff',
  'plex-sans-600.woff',
  'plex-sans-600-italic.woff',
  'plex-mono-400.woff',
]
let ready: Promise<void> | undefined
// @types/pdfmake does not describe 0.3's virtual file system.
const vfs = (pdfmake as unknown as { virtualfs: { writeFileSync(name: string, data: Buffer): void } }).virtualfs

/** Loads the fonts that ship with the app (server assets, IBM Plex under the SIL OFL) once. */
function loadFonts(): Promise<void> {
  ready ??= (async () => {
    const assets = useStorage('assets:server')
    for (const name of FONT_FILES) {
      const raw = await assets.getItemRaw(`fonts:${name}`)
      if (!raw) throw new Error(`PDF font ${name} missing from server assets`)
      vfs.writeFileSync(name, Buffer.from(raw as Uint8Array))
    }
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
  })()
  return ready
}

/** Renders a pdfmake document definition to PDF bytes. */
export async function renderPdf(doc: TDocumentDefinitions): Promise<Buffer> {
  await loadFonts()
  const out = pdfmake.createPdf({ ...doc, defaultStyle: { font: 'Plex', fontSize: 10, ...doc.defaultStyle } })
  return Buffer.from(await out.getBuffer())
}
