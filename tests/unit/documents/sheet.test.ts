import { describe, expect, it } from 'vitest'
import { formatCents } from '@shared/domain/billing'
import { LETTER, letterhead, qrWithLink, Sheet } from '../../../server/documents/index'
import { pdfInfo, pdfText, readQrOfPdf, renderFirstPage } from '../../helpers/pdf'

// The layout toolkit every letter is written on, exercised the way a notice will use it.
async function sampleLetter(language: 'en' | 'es', paragraphs: number) {
  const sheet = await Sheet.create({ ...LETTER, margin: { top: 54, right: 60, bottom: 60, left: 60 }, title: 'Sample', language })
  letterhead(sheet, { name: 'Orrin Flats Towing & Storage', address: '410 Quarry Road, Orrin Flats', phone: '(555) 010-0142' }, language === 'es' ? 'Aviso' : 'Notice')
  sheet.heading(language === 'es' ? 'Aviso de almacenaje: ¿qué sigue?' : 'Notice of storage')
  sheet.labelValues([
    [language === 'es' ? 'Vehículo' : 'Vehicle', '2011 Halvard Finch Wagon'],
    // An invented VIN-shaped string: this is about layout, not a real vehicle.
    ['VIN', 'HF1SAMPLE00000042'],
    [language === 'es' ? 'Dueño' : 'Owner', 'José Muñoz Güemes'],
  ])
  for (let i = 0; i < paragraphs; i++) {
    sheet.paragraph(
      language === 'es'
        ? `Párrafo ${i + 1}. ¡Atención! Su vehículo está guardado en nuestro depósito desde el miércoles. Según las normas de almacenaje, el cargo diario sigue acumulándose hasta que lo recoja; traiga una identificación con foto y el título o el registro.`
        : `Paragraph ${i + 1}. Your vehicle has been stored at our yard since Wednesday. Storage charges accrue each day until it is collected; bring photo identification and the title or registration.`,
    )
  }
  sheet.heading(language === 'es' ? 'Cargos' : 'Charges', 2)
  sheet.moneyTable(
    [
      { label: language === 'es' ? 'Remolque' : 'Tow', cents: 18_500 },
      { label: language === 'es' ? 'Almacenaje' : 'Storage', cents: 104_956, note: language === 'es' ? '23 días' : '23 days' },
    ],
    { cents: 123_456 },
    formatCents,
  )
  sheet.space(12)
  qrWithLink(sheet, 'https://yard.test.example/o/ABCD-2345', language === 'es' ? 'Vea su vehículo en línea:' : 'See your vehicle online:', 'yard.test.example/o/ABCD-2345')
  sheet.caution()
  return sheet.finish()
}

// Each test runs poppler's tools on a real file: seconds on a busy machine.
describe('the document toolkit', { timeout: 30_000 }, () => {
  it('writes a Spanish letter on US Letter with every accented character, the money, the caution and page numbers', async () => {
    const pdf = await sampleLetter('es', 14)
    const png = await renderFirstPage(pdf, 'toolkit-letter-es')
    const info = await pdfInfo(pdf)
    expect(info).toMatchObject({ pages: 2, widthPt: 612, heightPt: 792 })
    const text = await pdfText(pdf)
    for (const word of ['¿qué sigue?', 'Vehículo', 'José Muñoz Güemes', '¡Atención!', 'está', 'miércoles', 'Según', 'días', 'línea']) expect(text).toContain(word)
    expect(text).toContain('$185.00')
    expect(text).toContain('$1,049.56')
    expect(text).toContain('$1,234.56')
    expect(text).toContain('Verifique las normas de su lugar')
    expect(text).toContain('asesor legal')
    expect(text).toContain('Página 1 de 2')
    expect(text).toContain('Página 2 de 2')
    expect(text).toContain('yard.test.example/o/ABCD-2345')
    // The paragraphs ran onto page 2 in order: none lost at the page break.
    const order = [...text.matchAll(/Párrafo (\d+)\./g)].map((m) => Number(m[1]))
    expect(order).toEqual(Array.from({ length: 14 }, (_, i) => i + 1))
    expect(png).toMatch(/toolkit-letter-es\.png$/)
  })

  it('puts a readable QR code beside its short link', async () => {
    const pdf = await sampleLetter('en', 1)
    expect((await pdfInfo(pdf)).pages).toBe(1)
    expect(await readQrOfPdf(pdf, 'toolkit-letter-en')).toBe('https://yard.test.example/o/ABCD-2345')
    expect(await pdfText(pdf)).toContain('Check the rules where you are')
  })

  it('wraps at spaces within the width and cuts a word longer than a line', async () => {
    const sheet = await Sheet.create({ ...LETTER, margin: { top: 54, right: 60, bottom: 60, left: 60 }, title: 'Wrap', language: 'en' })
    const lines = sheet.wrap('one two three four five six seven eight nine ten', 60)
    expect(lines.join(' ')).toBe('one two three four five six seven eight nine ten')
    for (const line of lines) expect(sheet.width(line)).toBeLessThanOrEqual(60)
    const long = sheet.wrap('A'.repeat(80), 60)
    expect(long.join('')).toBe('A'.repeat(80))
    expect(long.length).toBeGreaterThan(1)
  })
})
