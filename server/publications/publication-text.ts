import type { Language } from '../documents/index'

export interface PublicationTextData {
  yard: { name: string; address: string; phone: string | null }
  vehicle: { year: number | null; make: string | null; model: string | null; vin: string | null; plate: string | null; plateState: string | null; colour: string | null; stockNumber: string }
  /** The first day the clocks let the sale be held, when they can say yet. */
  saleNotBefore: string | null
  citation: string
}

const longDay = (day: string, language: Language) =>
  new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(new Date(`${day}T12:00:00Z`))

/**
 * The notice as the newspaper prints it: plain text the office sends the paper, in Holdfast's words —
 * who sells, what, where and from when, and the rule. The yard fills in the hour of the sale.
 */
export function publicationText(d: PublicationTextData, language: Language): string {
  const v = d.vehicle
  const vehicle = [v.year, v.make, v.model].filter(Boolean).join(' ') || (language === 'es' ? 'Vehículo' : 'Vehicle')
  const plate = v.plate ? [v.plate, v.plateState].filter(Boolean).join(' ') : language === 'es' ? 'sin placa' : 'no plate'
  const vin = v.vin ?? (language === 'es' ? 'sin VIN' : 'no VIN')
  if (language === 'es') {
    return [
      'AVISO DE VENTA POR GRAVAMEN (LIEN SALE)',
      '',
      `${d.yard.name}, ${d.yard.address}, venderá en venta por gravamen, para cobrar los cargos de arrastre y almacenaje, el siguiente vehículo:`,
      '',
      `${vehicle}${v.colour ? `, ${v.colour}` : ''} · VIN ${vin} · placa ${plate} · n.º de inventario ${v.stockNumber}`,
      '',
      d.saleNotBefore
        ? `La venta se hará en ${d.yard.address}, no antes del ${longDay(d.saleNotBefore, 'es')}, a las ____ horas.`
        : `La venta se hará en ${d.yard.address}, el ____________ a las ____ horas.`,
      `Quien tenga un interés en el vehículo puede comunicarse con el patio${d.yard.phone ? ` al ${d.yard.phone}` : ''} antes de la venta.`,
      '',
      `Según ${d.citation}`,
    ].join('\n')
  }
  return [
    'NOTICE OF LIEN SALE',
    '',
    `${d.yard.name}, ${d.yard.address}, will sell at lien sale, to satisfy its charges for towing and storage, the following vehicle:`,
    '',
    `${vehicle}${v.colour ? `, ${v.colour}` : ''} · VIN ${vin} · plate ${plate} · stock number ${v.stockNumber}`,
    '',
    d.saleNotBefore
      ? `The sale will be held at ${d.yard.address}, not before ${longDay(d.saleNotBefore, 'en')}, at ____ (time).`
      : `The sale will be held at ${d.yard.address} on ____________ at ____ (time).`,
    `Anyone with an interest in the vehicle may contact the yard${d.yard.phone ? ` at ${d.yard.phone}` : ''} before the sale.`,
    '',
    `Under ${d.citation}`,
  ].join('\n')
}
