import type { PDFDocument, PDFFont, PDFPage } from 'pdf-lib'
import { barlow, sharedFontkit, type FontName } from './fonts'
import { PALETTE, type Colour } from './palette'
import { COMMON_WORDS, type Language } from './words'

// pdf-lib and fontkit load with the first document, not at start-up (about a third of a second).
let loadedLibraries: Promise<[typeof import('pdf-lib'), ReturnType<typeof sharedFontkit>]> | undefined
const libraries = () =>
  (loadedLibraries ??= Promise.all([import('pdf-lib'), import('@pdf-lib/fontkit').then((fontkit) => sharedFontkit(fontkit.default))]))
type PdfLib = Awaited<ReturnType<typeof libraries>>[0]

export const INCH = 72
/** US Letter, in points. */
export const LETTER = { width: 8.5 * INCH, height: 11 * INCH }

export interface SheetOptions {
  width: number
  height: number
  margin: { top: number; right: number; bottom: number; left: number }
  title: string
  language: Language
  /** Page numbers in the foot of every page (letters); off for a label. */
  pageNumbers?: boolean
}

export interface TextStyle {
  size?: number
  font?: FontName
  colour?: Colour
}

/**
 * One PDF being written top to bottom: the page set-up, a cursor (`y`, in points from the page's
 * foot, moving down), the embedded Barlow fonts, and the drawing every document shares. Blocks that
 * do not fit on the page start a new one. Documents build on it (see key-tag.ts); finish() numbers
 * the pages and returns the bytes.
 */
export class Sheet {
  page: PDFPage
  y: number
  readonly words

  private constructor(
    readonly lib: PdfLib,
    readonly doc: PDFDocument,
    readonly fonts: Record<FontName, PDFFont>,
    readonly options: SheetOptions,
  ) {
    this.words = COMMON_WORDS[options.language]
    this.page = doc.addPage([options.width, options.height])
    this.y = options.height - options.margin.top
  }

  static async create(options: SheetOptions): Promise<Sheet> {
    const [lib, fontkit] = await libraries()
    const doc = await lib.PDFDocument.create()
    doc.registerFontkit(fontkit as Parameters<PDFDocument['registerFontkit']>[0])
    const bytes = await barlow()
    // Subset: only the glyphs a document uses are embedded (a letter is tens of KB, not hundreds).
    const [regular, medium, bold] = await Promise.all([bytes.regular, bytes.medium, bytes.bold].map((b) => doc.embedFont(b, { subset: true })))
    doc.setTitle(options.title)
    doc.setLanguage(options.language === 'es' ? 'es-US' : 'en-US')
    doc.setCreator('Holdfast')
    doc.setProducer('Holdfast')
    return new Sheet(lib, doc, { regular: regular!, medium: medium!, bold: bold! }, options)
  }

  get left() {
    return this.options.margin.left
  }
  get right() {
    return this.options.width - this.options.margin.right
  }
  get contentWidth() {
    return this.right - this.left
  }

  colour(name: Colour) {
    return this.lib.rgb(...PALETTE[name])
  }

  /** Starts a new page when `height` more points would run into the bottom margin. */
  ensure(height: number) {
    if (this.y - height >= this.options.margin.bottom) return
    this.page = this.doc.addPage([this.options.width, this.options.height])
    this.y = this.options.height - this.options.margin.top
  }

  space(points: number) {
    this.y -= points
  }

  width(text: string, style: TextStyle = {}) {
    return this.fonts[style.font ?? 'regular'].widthOfTextAtSize(text, style.size ?? 10)
  }

  /** Draws one line with its baseline at `y`; nothing moves. */
  text(text: string, x: number, y: number, style: TextStyle = {}) {
    this.page.drawText(text, { x, y, size: style.size ?? 10, font: this.fonts[style.font ?? 'regular'], color: this.colour(style.colour ?? 'ink') })
  }

  /** Breaks text into lines no wider than `width`, at spaces; a word longer than a line is cut. */
  wrap(text: string, width: number, style: TextStyle = {}): string[] {
    const lines: string[] = []
    for (const paragraph of text.split('\n')) {
      let line = ''
      for (const word of paragraph.split(/\s+/).filter(Boolean)) {
        const next = line ? `${line} ${word}` : word
        if (this.width(next, style) <= width) {
          line = next
          continue
        }
        if (line) lines.push(line)
        line = word
        while (this.width(line, style) > width && line.length > 1) {
          let cut = line.length - 1
          while (cut > 1 && this.width(line.slice(0, cut), style) > width) cut--
          lines.push(line.slice(0, cut))
          line = line.slice(cut)
        }
      }
      lines.push(line)
    }
    return lines
  }

  /** Wrapped text from the cursor down, across pages if it must; `indent` and `width` narrow it. */
  paragraph(text: string, style: TextStyle & { indent?: number; width?: number; after?: number } = {}) {
    const size = style.size ?? 10
    const leading = size * 1.3
    const x = this.left + (style.indent ?? 0)
    for (const line of this.wrap(text, style.width ?? this.contentWidth - (style.indent ?? 0), style)) {
      this.ensure(leading)
      this.y -= leading
      this.text(line, x, this.y + leading - size, style)
    }
    this.y -= style.after ?? size * 0.6
  }

  heading(text: string, level: 1 | 2 = 1) {
    const size = level === 1 ? 16 : 12
    this.ensure(size * 2.6)
    this.y -= level === 1 ? size * 0.8 : size * 0.6
    this.paragraph(text, { size, font: level === 1 ? 'bold' : 'medium', colour: level === 1 ? 'ink' : 'steel', after: size * 0.4 })
  }

  rule(colour: Colour = 'rule', thickness = 0.75) {
    this.page.drawLine({ start: { x: this.left, y: this.y }, end: { x: this.right, y: this.y }, thickness, color: this.colour(colour) })
  }

  /** Label / value pairs in two columns: the label muted and narrow, the value wrapped beside it. */
  labelValues(rows: readonly (readonly [label: string, value: string])[], options: { labelWidth?: number; size?: number } = {}) {
    const size = options.size ?? 10
    const leading = size * 1.3
    const labelWidth = options.labelWidth ?? 130
    for (const [label, value] of rows) {
      const lines = this.wrap(value || '—', this.contentWidth - labelWidth, { size })
      this.ensure(leading * lines.length)
      const top = this.y - size
      this.text(label, this.left, top, { size: size - 1, colour: 'muted', font: 'medium' })
      lines.forEach((line, i) => this.text(line, this.left + labelWidth, top - i * leading, { size }))
      this.y -= leading * lines.length + size * 0.3
    }
    this.y -= size * 0.6
  }

  /**
   * Money lines with the amounts in a right-aligned column and a total under a rule. Amounts are
   * integer cents, formatted by the one formatter the caller passes (shared/domain/billing's formatCents).
   */
  moneyTable(lines: readonly { label: string; cents: number; note?: string }[], total: { label?: string; cents: number }, format: (cents: number) => string) {
    const size = 10
    const leading = size * 1.45
    const amountWidth = 90
    for (const line of lines) {
      const label = this.wrap(line.note ? `${line.label} — ${line.note}` : line.label, this.contentWidth - amountWidth - 12, { size })
      this.ensure(leading * label.length)
      const top = this.y - size
      label.forEach((l, i) => this.text(l, this.left, top - i * leading, { size }))
      const amount = format(line.cents)
      this.text(amount, this.right - this.width(amount, { size }), top, { size })
      this.y -= leading * label.length
    }
    this.ensure(leading * 2)
    this.y -= size * 0.4
    this.rule('ink', 1)
    const top = this.y - size * 1.4
    const amount = format(total.cents)
    this.text(total.label ?? this.words.total, this.left, top, { size, font: 'bold' })
    this.text(amount, this.right - this.width(amount, { size, font: 'bold' }), top, { size, font: 'bold' })
    this.y = top - size
  }

  /** The legal caution, in an amber-edged box (state never by colour alone: it has its title). */
  caution(text = this.words.caution, title = this.words.cautionTitle) {
    const size = 9
    const leading = size * 1.3
    const pad = 8
    const lines = this.wrap(text, this.contentWidth - pad * 2 - 4, { size })
    const height = pad * 2 + size * 1.6 + lines.length * leading
    this.ensure(height + 6)
    this.y -= 6
    const bottom = this.y - height
    this.page.drawRectangle({ x: this.left, y: bottom, width: this.contentWidth, height, color: this.colour('paper'), borderColor: this.colour('rule'), borderWidth: 0.5 })
    this.page.drawRectangle({ x: this.left, y: bottom, width: 4, height, color: this.colour('amber') })
    let line = this.y - pad - size
    this.text(title, this.left + pad + 4, line, { size, font: 'bold' })
    line -= size * 1.6
    for (const l of lines) {
      this.text(l, this.left + pad + 4, line, { size })
      line -= leading
    }
    this.y = bottom - 6
  }

  /** "Page n of m" centred in the foot of every page, and the bytes. */
  async finish(): Promise<Uint8Array> {
    if (this.options.pageNumbers !== false) {
      const pages = this.doc.getPages()
      pages.forEach((page, i) => {
        const label = this.words.page(i + 1, pages.length)
        const size = 8
        page.drawText(label, {
          x: (this.options.width - this.width(label, { size })) / 2,
          y: this.options.margin.bottom / 2,
          size,
          font: this.fonts.regular,
          color: this.colour('muted'),
        })
      })
    }
    return this.doc.save()
  }
}
