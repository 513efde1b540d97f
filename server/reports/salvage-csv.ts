import type { SalvageRow } from '@shared/schemas/reports'
import { csvLine } from './csv'

const HEADER = ['VIN', 'Stock number', 'Vehicle', 'Date obtained', 'Obtained from', 'Disposition', 'Crushed', 'Disposed of to', 'For export']
const DISPOSITION = { title_transferred: 'Title transferred', lien_sale: 'Lien sale or disposal', scrapped: 'Scrapped' } as const

/** The salvage inventory as CSV lines, header first, every cell escaped (csv.ts). */
export function* salvageCsv(rows: readonly SalvageRow[]): Generator<string> {
  yield csvLine(HEADER)
  for (const r of rows) {
    yield csvLine([r.vin ?? 'not recorded', r.stockNumber, r.vehicle, r.obtainedOn, r.fromWhom ?? 'unknown', DISPOSITION[r.disposition], r.crushed ? 'yes' : 'no', r.toWhom ?? 'not recorded', r.forExport === null ? 'not recorded' : r.forExport ? 'yes' : 'no'])
  }
}
