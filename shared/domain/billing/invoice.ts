import type { StorageBill } from './storage-bill'
import type { Cents } from './money'

export interface InvoiceLine {
  kind: 'tow' | 'storage' | 'fee'
  code: string
  label: string
  es?: { label?: string }
  quantity: number
  unitCents: Cents
  amountCents: Cents
  taxCents: Cents
}

export interface InvoiceCharges {
  lines: InvoiceLine[]
  subtotalCents: Cents
  taxCents: Cents
  totalCents: Cents
}

/**
 * A vehicle's charges: the tow charge as worked out at tow-in (the rule sets tax storage and their
 * fees, not the tow), then the storage bill's own lines with their tax. The total is the core's
 * bill total plus the tow, the same sum as the running balance (server/charges) gives.
 */
export function invoiceCharges(bill: StorageBill, towCents: Cents, towLabel = 'Tow'): InvoiceCharges {
  const lines: InvoiceLine[] = []
  if (towCents > 0) lines.push({ kind: 'tow', code: 'tow', label: towLabel, quantity: 1, unitCents: towCents, amountCents: towCents, taxCents: 0 })
  for (const l of bill.lines) {
    lines.push({ kind: l.kind, code: l.code, label: l.label, ...(l.es ? { es: l.es } : {}), quantity: l.quantity, unitCents: l.unitCents, amountCents: l.amountCents, taxCents: l.taxCents })
  }
  const subtotalCents = towCents + bill.subtotalCents
  return { lines, subtotalCents, taxCents: bill.taxCents, totalCents: subtotalCents + bill.taxCents }
}
