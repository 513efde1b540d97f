// Stock numbers read "<yard code>-<year>-<sequence>", e.g. TC-2026-00041: the year is the arrival's year
// in the yard's own time zone, and the sequence never goes back (db stock_counters).
export function formatStockNumber(yardCode: string, year: number, sequence: number): string {
  return `${yardCode}-${year}-${String(sequence).padStart(5, '0')}`
}

export function yearInZone(instant: Date, timeZone: string): number {
  return Number(new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric' }).format(instant))
}
