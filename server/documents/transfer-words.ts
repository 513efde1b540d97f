import type { IdType } from '@shared/schemas/releases'
import type { BuyerKind, TransferKind } from '@shared/schemas/transfers'
import type { Language } from './words'

const ES_EXEMPTIONS: Record<string, string> = {
  '49 CFR 580.17(a)(1)': 'Exento: su GVWR pasa de 16,000 lb.',
  '49 CFR 580.17(a)(2)': 'Exento: el vehículo no es autopropulsado.',
  '49 CFR 580.17(a)(3)': 'Exento: un vehículo modelo 2010 o anterior transferido al menos 10 años después del 1 de enero de su año modelo.',
  '49 CFR 580.17(a)(4)': 'Exento: un vehículo modelo 2011 o posterior transferido al menos 20 años después del 1 de enero de su año modelo.',
}

// The title-transfer packet's words, per language (the screen's are in src/locales/*/transfers.json).
export const TRANSFER_WORDS: Record<Language, {
  title: string
  kinds: Record<TransferKind, string>
  buyerKinds: Record<BuyerKind, string>
  idTypes: Record<IdType, string>
  billOfSale: string
  saleStatement: (kind: TransferKind) => string
  seller: string
  buyer: string
  buyerAddress: string
  buyerId: string
  price: string
  date: string
  kind: string
  vehicle: string
  stockNumber: string
  vin: string
  year: string
  make: string
  model: string
  plate: string
  none: string
  proceeds: string
  salePrice: string
  applied: string
  surplus: string
  dueOnSaleDay: (due: string, shortfall: string) => string
  surplusNote: string
  odometerTitle: string
  odometerWarning: string
  odometerReads: (miles: string) => string
  odometerUnreadable: string
  odometerBoxes: readonly string[]
  odometerExempt: (reason: string, clause: string) => string
  checklist: string
  checklistItems: (kind: TransferKind, needsOdometer: boolean, buyerShowsId: boolean) => string[]
  signatures: string
  sellerSignature: string
  buyerSignature: string
  signedBy: (name: string, at: string) => string
  dateLine: string
  printed: (at: string) => string
}> = {
  en: {
    title: 'Title transfer packet',
    kinds: { signed_over: 'Signed over by the owner', lien_sale: 'Lien sale' },
    buyerKinds: { yard: 'The yard', salvage_buyer: 'Salvage buyer', other: 'Buyer at the sale' },
    idTypes: { drivers_license: "Driver's licence", state_id: 'State ID card', passport: 'Passport', military_id: 'Military ID', other: 'Other ID' },
    billOfSale: 'Bill of sale',
    saleStatement: (kind) =>
      kind === 'lien_sale'
        ? 'The seller, holding a lien on the vehicle below for towing and storage, sells it to the buyer for the price shown, as is, under the lien-sale law of the state.'
        : 'The seller, the owner of the vehicle below, transfers it to the buyer for the price shown, as is.',
    seller: 'Seller',
    buyer: 'Buyer',
    buyerAddress: "Buyer's address",
    buyerId: "Buyer's ID",
    price: 'Price',
    date: 'Date of sale',
    kind: 'Transfer',
    vehicle: 'Vehicle',
    stockNumber: 'Stock number',
    vin: 'VIN',
    year: 'Year',
    make: 'Make',
    model: 'Model',
    plate: 'Plate',
    none: 'Not recorded',
    proceeds: 'Proceeds of the sale',
    salePrice: 'Sale price',
    applied: 'Applied to the towing and storage charges',
    surplus: 'Surplus owed to the owner',
    dueOnSaleDay: (due, shortfall) => `Charges owed on the day of the sale: ${due}. Not covered by the price: ${shortfall}.`,
    surplusNote: 'A surplus is not the yard’s: it is held for the owner, or paid as the state’s lien-sale law directs.',
    odometerTitle: 'Odometer disclosure statement (49 CFR 580.5)',
    odometerWarning: 'Federal law, and state law where it applies, requires the seller to state the mileage when ownership is transferred. Failing to complete this statement, or making a false one, may result in fines and/or imprisonment.',
    odometerReads: (miles) => `I, the seller, state that the odometer now reads ${miles} miles (no tenths) and, to the best of my knowledge, that:`,
    odometerUnreadable: 'I, the seller, state that the odometer could not be read: the mileage is NOT the actual mileage. WARNING — ODOMETER DISCREPANCY.',
    odometerBoxes: ['it reflects the actual mileage of the vehicle;', 'it reflects mileage in excess of its mechanical limits;', 'it is NOT the actual mileage. WARNING — ODOMETER DISCREPANCY.'],
    odometerExempt: (reason, clause) => `No odometer statement is needed for this transfer. ${reason} (${clause})`,
    checklist: 'What must be brought and signed',
    checklistItems: (kind, needsOdometer, buyerShowsId) => [
      kind === 'lien_sale'
        ? "The state's lien-sale papers for the title (the yard's authority to sell), completed and signed by the yard"
        : 'The certificate of title, signed over by every owner named on it',
      'A release of lien from every lienholder named on the title (or the lien-sale papers that end it)',
      'This bill of sale, signed by the seller and the buyer',
      ...(needsOdometer ? ['The odometer disclosure statement above, signed by the seller and the buyer'] : []),
      ...(buyerShowsId ? ["The buyer's ID, seen and its number written above"] : []),
      ...(kind === 'lien_sale' ? ['Proof of the notices mailed, and of the publication where the law requires one'] : []),
    ],
    signatures: 'Signatures',
    sellerSignature: 'Seller (transferor)',
    buyerSignature: 'Buyer (transferee)',
    signedBy: (name, at) => `Signed by ${name}, ${at}`,
    dateLine: 'Date',
    printed: (at) => `Printed ${at}`,
  },
  es: {
    title: 'Paquete de transferencia del título',
    kinds: { signed_over: 'Cedido por el dueño', lien_sale: 'Venta por gravamen (lien sale)' },
    buyerKinds: { yard: 'El patio', salvage_buyer: 'Comprador de salvamento', other: 'Comprador en la venta' },
    idTypes: { drivers_license: 'Licencia de conducir', state_id: 'Identificación estatal', passport: 'Pasaporte', military_id: 'Identificación militar', other: 'Otra identificación' },
    billOfSale: 'Contrato de compraventa (bill of sale)',
    saleStatement: (kind) =>
      kind === 'lien_sale'
        ? 'El vendedor, que tiene un gravamen sobre el vehículo de abajo por arrastre y almacenaje, se lo vende al comprador por el precio indicado, tal como está, según la ley de venta por gravamen del estado.'
        : 'El vendedor, dueño del vehículo de abajo, se lo transfiere al comprador por el precio indicado, tal como está.',
    seller: 'Vendedor',
    buyer: 'Comprador',
    buyerAddress: 'Dirección del comprador',
    buyerId: 'Identificación del comprador',
    price: 'Precio',
    date: 'Fecha de la venta',
    kind: 'Transferencia',
    vehicle: 'Vehículo',
    stockNumber: 'N.º de inventario',
    vin: 'VIN',
    year: 'Año',
    make: 'Marca',
    model: 'Modelo',
    plate: 'Placa',
    none: 'Sin registrar',
    proceeds: 'Producto de la venta',
    salePrice: 'Precio de venta',
    applied: 'Aplicado a los cargos de arrastre y almacenaje',
    surplus: 'Excedente a favor del dueño',
    dueOnSaleDay: (due, shortfall) => `Cargos adeudados el día de la venta: ${due}. Sin cubrir por el precio: ${shortfall}.`,
    surplusNote: 'El excedente no es del patio: se guarda para el dueño, o se paga como indique la ley de venta por gravamen del estado.',
    odometerTitle: 'Declaración de odómetro (49 CFR 580.5)',
    odometerWarning: 'La ley federal, y la estatal donde aplique, exige que el vendedor declare el millaje al transferir la propiedad. No completar esta declaración, o hacer una falsa, puede acarrear multas y/o prisión.',
    odometerReads: (miles) => `Yo, el vendedor, declaro que el odómetro marca ahora ${miles} millas (sin décimas) y, a mi leal saber, que:`,
    odometerUnreadable: 'Yo, el vendedor, declaro que no se pudo leer el odómetro: el millaje NO es el real. ADVERTENCIA — DISCREPANCIA DEL ODÓMETRO.',
    odometerBoxes: ['refleja el millaje real del vehículo;', 'refleja un millaje mayor que sus límites mecánicos;', 'NO es el millaje real. ADVERTENCIA — DISCREPANCIA DEL ODÓMETRO.'],
    // The core words its reason in English; in Spanish the clause says which exemption applies.
    odometerExempt: (_reason, clause) => `Esta transferencia no necesita declaración de odómetro. ${ES_EXEMPTIONS[clause] ?? 'Exento.'} (${clause})`,
    checklist: 'Qué hay que traer y firmar',
    checklistItems: (kind, needsOdometer, buyerShowsId) => [
      kind === 'lien_sale'
        ? 'Los papeles de venta por gravamen del estado para el título (la autorización del patio para vender), llenos y firmados por el patio'
        : 'El título de propiedad, cedido y firmado por cada dueño que aparece en él',
      'La liberación del gravamen de cada acreedor prendario que aparece en el título (o los papeles de la venta que lo terminan)',
      'Este contrato de compraventa, firmado por el vendedor y el comprador',
      ...(needsOdometer ? ['La declaración de odómetro de arriba, firmada por el vendedor y el comprador'] : []),
      ...(buyerShowsId ? ['La identificación del comprador, vista y con su número anotado arriba'] : []),
      ...(kind === 'lien_sale' ? ['Prueba de los avisos enviados por correo, y de la publicación donde la ley la exige'] : []),
    ],
    signatures: 'Firmas',
    sellerSignature: 'Vendedor (quien transfiere)',
    buyerSignature: 'Comprador (quien recibe)',
    signedBy: (name, at) => `Firmado por ${name}, ${at}`,
    dateLine: 'Fecha',
    printed: (at) => `Impreso ${at}`,
  },
}
