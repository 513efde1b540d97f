import type { ReceivableRow } from '@shared/schemas/reports'
import { csvDollars, csvLine } from './csv'

const HEADER = ['Stock number', 'Vehicle', 'Plate', 'Column', 'Arrived', 'Storage days', 'Tow', 'Storage', 'Charged', 'Credited', 'Paid', 'Due', 'Next deadline', 'Next deadline date']

/** The receivables as CSV lines, header first; money in dollars, every cell escaped (csv.ts). */
export function* receivablesCsv(rows: readonly ReceivableRow[]): Generator<string> {
  yield csvLine(HEADER)
  for (const r of rows) {
    yield csvLine([
      r.stockNumber,
      r.vehicle,
      r.plate,
      r.state,
      r.arrivedAt,
      r.daysOnLot,
      csvDollars(r.towCents),
      csvDollars(r.storageCents),
      csvDollars(r.chargesCents),
      csvDollars(r.creditedCents),
      csvDollars(r.paidCents),
      csvDollars(r.dueCents),
      r.nextDeadline?.label,
      r.nextDeadline?.dueDate,
    ])
  }
}
