import { PDF_FONT_FILES, type PdfFonts } from './pdf-core'

let fonts: Promise<PdfFonts> | undefined

/** The PDF fonts read once from the server assets, for the worker threads that render PDFs. */
export function pdfFonts(): Promise<PdfFonts> {
  fonts ??= (async () => {
    const assets = useStorage('assets:server')
    const out: Partial<PdfFonts> = {}
    for (const name of PDF_FONT_FILES) {
      const raw = await assets.getItemRaw(`fonts:${name}`)
      if (!raw) throw new Error(`PDF font ${name} missing from server assets`)
      out[name] = new Uint8Array(raw as Uint8Array)
    }
    return out as PdfFonts
  })()
  fonts.catch(() => { fonts = undefined })
  return fonts
}
