// pdf-lib is loaded on the first PDF, not at start-up: importing it costs about a third of a second.
const pdfLib = () => import('pdf-lib')

export class UnreadablePdfError extends Error {}

// Entries that carry who made the file, or actions a viewer would run on opening it.
const CATALOG_KEYS = ['Metadata', 'OpenAction', 'AA', 'Names']

/** Re-saves a PDF without its document information, XMP metadata and open actions. */
export async function cleanPdf(input: Buffer): Promise<Buffer> {
  const { PDFDocument, PDFName } = await pdfLib()
  let doc: Awaited<ReturnType<typeof PDFDocument.load>>
  try {
    doc = await PDFDocument.load(input, { updateMetadata: false })
  } catch (err) {
    throw new UnreadablePdfError((err as Error).message)
  }
  for (const key of CATALOG_KEYS) doc.catalog.delete(PDFName.of(key))
  doc.context.trailerInfo.Info = undefined
  return Buffer.from(await doc.save({ updateFieldAppearances: false }))
}
