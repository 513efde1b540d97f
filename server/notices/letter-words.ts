import en from '@shared/messages/en/notices.json'
import es from '@shared/messages/es/notices.json'
import type { ContactRole } from '@shared/schemas/contacts'
import type { NoticeKind } from '@shared/schemas/notices'
import type { Language } from '../documents/index'

const CODES = { en: en.notices, es: es.notices }

/** Every date in a letter: "December 2, 2026" / "2 de diciembre de 2026" (a calendar day, no zone to shift it). */
export function longDate(day: string, language: Language): string {
  return new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`))
}

const EN_AS: Record<ContactRole, string> = {
  registered_owner: 'the registered owner',
  lienholder: 'the legal owner or a lienholder',
  insurer: 'the insurer',
  interested_party: 'a party with an interest',
}
const ES_AS: Record<ContactRole, string> = {
  registered_owner: 'el dueño registrado',
  lienholder: 'el dueño legal o un acreedor prendario',
  insurer: 'la aseguradora',
  interested_party: 'una persona con interés',
}

/**
 * The words of a notice letter, in the recipient's language. Holdfast's own wording; the rule's
 * label and citation are the rule set's own, in the recipient's language where it has them
 * (`ruleWords`), the statute's section as enacted.
 */
export const LETTER_WORDS = {
  en: {
    title: (kind: NoticeKind) => CODES.en.kinds[kind],
    dated: 'Date',
    to: 'To',
    vehicle: 'The vehicle',
    stock: 'Stock number',
    vin: 'VIN',
    yearMakeModel: 'Year, make, model',
    plate: 'Plate',
    unknown: 'not recorded',
    why: (role: ContactRole, yard: string) =>
      `You are receiving this notice because the records we have list you as ${EN_AS[role]} of the vehicle below. ${yard} towed and is storing it, and holds a lien on it for the towing and storage charges.`,
    chargesTitle: 'What is owed',
    chargesAsOf: (date: string) => `Charges as of ${date}`,
    tow: 'Towing',
    storage: (days: number) => `Storage, ${days} ${days === 1 ? 'day' : 'days'}`,
    totalAt: (date: string) => `Total if collected on ${date}`,
    accrues: 'Storage keeps adding up every day the vehicle stays in the yard.',
    nextTitle: 'What happens next',
    next: {
      owner_notice: (date: string) => `If the vehicle is not collected and the charges are not paid, the yard may sell or dispose of it through a lien sale on or after ${date}.`,
      sale_notice: (date: string) => `The vehicle will be sold at a lien sale on or after ${date} unless it is collected and the charges are paid before then. You may oppose the sale within the time the law allows.`,
      disposal_notice: (date: string) => `The vehicle may be disposed of to a licensed dismantler or scrap processor on or after ${date} unless it is collected and the charges are paid before then.`,
    } satisfies Record<NoticeKind, (date: string) => string>,
    nextUnknown: 'If the vehicle is not collected, the yard will go on to a lien sale as the rule below allows, and will write to you again with the date.',
    dueBy: (date: string) => `The rule set asks for this notice to be mailed by ${date}.`,
    backTitle: 'How to get the vehicle back',
    back: (yard: string, address: string) => `Come to ${yard}, ${address}. Bring photo identification and proof that you own the vehicle or have an interest in it (title or registration), and pay the charges.`,
    hours: (hours: string) => `Open: ${hours}.`,
    call: (phone: string) => `Call ${phone} before you come, or with any question.`,
    onlineTitle: 'See it online',
    online: 'Scan the code to see the vehicle, the charges on any day and your options:',
    orCode: (site: string) => `Or go to ${site} and type this code:`,
    ruleTitle: 'The rule',
    ruleSet: (name: string) => `Rule set: ${name}`,
    emailSubject: (kind: NoticeKind, stock: string, yard: string) => `${CODES.en.kinds[kind]}: vehicle ${stock} at ${yard}`,
    emailText: (name: string, yard: string, phone: string | null) =>
      `Dear ${name},\n\n${yard} holds a vehicle our records link to you. The notice attached (PDF) says what is owed, what happens next and on which date, and how to get the vehicle back. It also has a code to see the vehicle and its charges online.\n\n${phone ? `Questions: call ${phone}.\n\n` : ''}${yard}`,
  },
  es: {
    title: (kind: NoticeKind) => CODES.es.kinds[kind],
    dated: 'Fecha',
    to: 'Para',
    vehicle: 'El vehículo',
    stock: 'Número de inventario',
    vin: 'VIN',
    yearMakeModel: 'Año, marca, modelo',
    plate: 'Placa',
    unknown: 'sin registrar',
    why: (role: ContactRole, yard: string) =>
      `Le enviamos este aviso porque, según los registros que tenemos, usted es ${ES_AS[role]} del vehículo que se describe abajo. ${yard} lo remolcó y lo tiene almacenado, y tiene un gravamen sobre él por los cargos de remolque y almacenaje.`,
    chargesTitle: 'Lo que se debe',
    chargesAsOf: (date: string) => `Cargos al ${date}`,
    tow: 'Remolque',
    storage: (days: number) => `Almacenaje, ${days} ${days === 1 ? 'día' : 'días'}`,
    totalAt: (date: string) => `Total si lo recoge el ${date}`,
    accrues: 'El almacenaje sigue sumando cada día que el vehículo se queda en el depósito.',
    nextTitle: 'Qué sigue',
    next: {
      owner_notice: (date: string) => `Si nadie recoge el vehículo y paga los cargos, el depósito podrá venderlo o desecharlo mediante una venta por gravamen (lien sale) a partir del ${date}.`,
      sale_notice: (date: string) => `El vehículo se venderá en una venta por gravamen (lien sale) a partir del ${date}, a menos que lo recoja y pague los cargos antes. Puede oponerse a la venta dentro del plazo que fija la ley.`,
      disposal_notice: (date: string) => `El vehículo podrá entregarse a un desarmadero o chatarrería con licencia a partir del ${date}, a menos que lo recoja y pague los cargos antes.`,
    } satisfies Record<NoticeKind, (date: string) => string>,
    nextUnknown: 'Si nadie recoge el vehículo, el depósito seguirá con una venta por gravamen según lo permite la norma de abajo, y le volverá a escribir con la fecha.',
    dueBy: (date: string) => `Según las reglas, este aviso debe enviarse por correo a más tardar el ${date}.`,
    backTitle: 'Cómo recuperar el vehículo',
    back: (yard: string, address: string) => `Venga a ${yard}, ${address}. Traiga una identificación con foto y un comprobante de que el vehículo es suyo o de que tiene interés en él (título o registro), y pague los cargos.`,
    hours: (hours: string) => `Horario: ${hours}.`,
    call: (phone: string) => `Llame al ${phone} antes de venir, o si tiene alguna pregunta.`,
    onlineTitle: 'Véalo en línea',
    online: 'Escanee el código para ver el vehículo, los cargos de cualquier día y sus opciones:',
    orCode: (site: string) => `O entre a ${site} y escriba este código:`,
    ruleTitle: 'La norma',
    ruleSet: (name: string) => `Conjunto de reglas: ${name}`,
    emailSubject: (kind: NoticeKind, stock: string, yard: string) => `${CODES.es.kinds[kind]}: vehículo ${stock} en ${yard}`,
    emailText: (name: string, yard: string, phone: string | null) =>
      `Estimado/a ${name}:\n\n${yard} tiene un vehículo que, según nuestros registros, está relacionado con usted. El aviso adjunto (PDF) explica lo que se debe, qué sigue y en qué fecha, y cómo recuperar el vehículo. También trae un código para ver el vehículo y sus cargos en línea.\n\n${phone ? `Preguntas: llame al ${phone}.\n\n` : ''}${yard}`,
  },
} satisfies Record<Language, Record<string, unknown>>
