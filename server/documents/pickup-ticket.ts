import { pickupNeeds, type PickupEquipment, type PickupReason } from '@shared/domain/inspection'
import enInspection from '@shared/messages/en/inspection.json'
import esInspection from '@shared/messages/es/inspection.json'
import { letterhead, type YardHeading } from './letterhead'
import { yardDateTime } from './release-words'
import { LETTER, Sheet } from './sheet'
import type { Language } from './words'

export interface PickupTicketData {
  yard: YardHeading & { timeZone: string }
  vehicle: {
    stockNumber: string
    vin: string | null
    year: number | null
    make: string | null
    model: string | null
    colour: string | null
    plate: string | null
    plateState: string | null
    keys: 'yes' | 'no' | 'unknown'
    keysWhere: string | null
    rolls: boolean | null
    steers: boolean | null
    brakes: boolean | null
  }
  space: string | null
  printedAt: Date
}

const REASONS: Record<Language, Record<PickupReason, string>> = { en: enInspection.inspection.pickupReasons, es: esInspection.inspection.pickupReasons }

const WORDS = {
  en: {
    title: 'Pickup ticket',
    vehicle: 'Vehicle',
    vin: 'VIN',
    plate: 'Plate',
    colour: 'Colour',
    space: 'Space',
    keys: 'Keys',
    keysValue: { yes: 'Here', no: 'None', unknown: 'Not known' },
    keysWhere: 'Where',
    needs: 'What the pickup needs',
    equipment: { 'wheel-lift': 'Wheel-lift', flatbed: 'Flatbed', 'dollies-or-skates': 'Dollies or skates' } satisfies Record<PickupEquipment, string>,
    marks: (rolls: string, steers: string, brakes: string) => `Rolls: ${rolls} · Steers: ${steers} · Brakes: ${brakes}`,
    yes: 'yes',
    no: 'no',
    unmarked: 'The technician has not yet marked whether it rolls, steers and brakes: bring a flatbed, and ask at the office.',
    why: 'Why',
    cautionsTitle: 'Loading cautions',
    cautions: [
      'Set the parking brake and chock the wheels that stay on the ground before you winch or lift.',
      'Never reach or crawl under a vehicle held only by a jack, a winch line or the lift: support a raised vehicle on rated stands, on firm, level ground.',
      'Keep everyone clear of the winch line and the path of the vehicle while it moves.',
      'Secure the vehicle on the truck with rated straps or chains at four points before you drive.',
      "If a wheel was refitted to make it roll, its lug nuts were torqued to the maker's figure in a star pattern; check them before you drive.",
      "These are the usual cautions, not a procedure: follow the truck maker's and the vehicle maker's instructions and licensed practice.",
    ],
    printed: (at: string) => `Printed ${at}`,
    none: 'not recorded',
  },
  es: {
    title: 'Boleta de recogida',
    vehicle: 'Vehículo',
    vin: 'VIN',
    plate: 'Placa',
    colour: 'Color',
    space: 'Espacio',
    keys: 'Llaves',
    keysValue: { yes: 'Aquí', no: 'No hay', unknown: 'No se sabe' },
    keysWhere: 'Dónde',
    needs: 'Lo que necesita la recogida',
    equipment: { 'wheel-lift': 'De arrastre (wheel-lift)', flatbed: 'Plataforma', 'dollies-or-skates': 'Dollies o patines' } satisfies Record<PickupEquipment, string>,
    marks: (rolls: string, steers: string, brakes: string) => `Rueda: ${rolls} · Gira: ${steers} · Frena: ${brakes}`,
    yes: 'sí',
    no: 'no',
    unmarked: 'El técnico todavía no marcó si rueda, gira y frena: traiga una plataforma y pregunte en la oficina.',
    why: 'Por qué',
    cautionsTitle: 'Precauciones al cargar',
    cautions: [
      'Ponga el freno de mano y calce las ruedas que quedan en el suelo antes de usar el malacate o levantar.',
      'Nunca se meta debajo de un vehículo sostenido solo por un gato, el cable del malacate o la grúa: apoye el vehículo levantado en soportes certificados, sobre suelo firme y nivelado.',
      'Mantenga a todos lejos del cable del malacate y del camino del vehículo mientras se mueve.',
      'Asegure el vehículo en el camión con correas o cadenas certificadas en cuatro puntos antes de manejar.',
      'Si se volvió a montar una rueda para que ruede, las tuercas se apretaron al valor del fabricante en estrella; revíselas antes de manejar.',
      'Son las precauciones de costumbre, no un procedimiento: siga las instrucciones del fabricante del camión y del vehículo y la práctica autorizada.',
    ],
    printed: (at: string) => `Impreso ${at}`,
    none: 'sin registrar',
  },
} as const

/**
 * The pickup ticket for the driver collecting the vehicle: what it is, where it stands, the keys, and
 * what the truck must bring (shared/domain/inspection's pickupNeeds, from the technician's marks), with
 * the usual loading cautions (DESIGN.md, "Safety").
 */
export async function pickupTicket(d: PickupTicketData, language: Language): Promise<Uint8Array> {
  const w = WORDS[language]
  const margin = 0.6 * 72
  const sheet = await Sheet.create({ ...LETTER, margin: { top: margin, right: margin, bottom: margin, left: margin }, title: `${w.title} ${d.vehicle.stockNumber}`, language })
  letterhead(sheet, d.yard, w.title)
  const v = d.vehicle
  sheet.heading(v.stockNumber, 1)
  sheet.labelValues([
    [w.vehicle, [v.year, v.make, v.model].filter(Boolean).join(' ') || w.none],
    [w.colour, v.colour ?? w.none],
    [w.plate, v.plate ? [v.plate, v.plateState].filter(Boolean).join(' · ') : w.none],
    [w.vin, v.vin ?? w.none],
    [w.space, d.space ?? w.none],
    [w.keys, v.keysWhere ? `${w.keysValue[v.keys]} — ${w.keysWhere}: ${v.keysWhere}` : w.keysValue[v.keys]],
  ])
  sheet.heading(w.needs, 2)
  if (v.rolls === null || v.steers === null || v.brakes === null) sheet.paragraph(w.unmarked, { font: 'medium', colour: 'brick' })
  else {
    const needs = pickupNeeds({ rolls: v.rolls, steers: v.steers, brakes: v.brakes, keys: v.keys === 'yes' })
    sheet.paragraph(needs.equipment.map((e) => w.equipment[e]).join(' + '), { size: 16, font: 'bold', colour: 'steel' })
    const yn = (b: boolean) => (b ? w.yes : w.no)
    sheet.paragraph(w.marks(yn(v.rolls), yn(v.steers), yn(v.brakes)), { size: 10, colour: 'muted' })
    // The reasons by code, in the ticket's language (shared/messages/<locale>/inspection.json).
    for (const code of needs.reasonCodes) sheet.paragraph(`${w.why}: ${REASONS[language][code]}`, { size: 10 })
  }
  sheet.caution(w.cautions.map((c) => `• ${c}`).join('\n'), w.cautionsTitle)
  sheet.caution()
  sheet.paragraph(w.printed(yardDateTime(d.printedAt, d.yard.timeZone, language)), { size: 8, colour: 'muted' })
  return sheet.finish()
}
