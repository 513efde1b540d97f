// The invented company behind the demo. Phone numbers use 555-01xx, the range kept for fiction.
export const DEMO_PASSWORD = 'quarry-spur-demo'

export const DEMO_COMPANY = {
  name: 'Tamsin Creek Towing & Storage',
  phone: '(559) 555-0142',
  address: '1480 Quarry Spur Road, Orrin Flats, CA 93599',
}

export const DEMO_YARD = {
  name: 'Quarry Spur yard',
  code: 'TC',
  address: '1480 Quarry Spur Road, Orrin Flats, CA 93599',
  phone: '(559) 555-0142',
  hours: 'Mon–Fri 8:00–17:00 · Sat 9:00–12:00',
  lat: 36.4127,
  lng: -119.3521,
  timeZone: 'America/Los_Angeles',
  labourRateCents: 12_500,
  towRates: {
    hookUpCents: 19_500,
    perMileCents: 650,
    includedMiles: 5,
    winchingCentsPerUnit: 9_500,
    dolliesCents: 7_500,
    afterHoursCents: 8_500,
    note: 'Demo rates for an invented yard; set your own.',
  },
}

export const DEMO_STAFF = [
  { name: 'Delia Marchetti', email: 'delia@tamsincreek.example', role: 'manager' },
  { name: 'Ruben Okafor', email: 'ruben@tamsincreek.example', role: 'dispatcher' },
  { name: 'Sunny Halvorsen', email: 'sunny@tamsincreek.example', role: 'technician' },
  { name: 'Priya Castellanos', email: 'priya@tamsincreek.example', role: 'office' },
] as const

export const DEMO_DRIVERS = [
  { driver: 'Jody Kincaid', truck: 'Truck 3 — flatbed' },
  { driver: 'Tomas Reyna', truck: 'Truck 5 — wheel-lift' },
  { driver: 'Neve Castellanos', truck: 'Truck 7 — heavy wrecker' },
]

/** Rows A–E hold cars, row W the wide spaces for trucks over 25 ft, row M the motorcycles. */
export const DEMO_SPACES = [
  ...['A', 'B', 'C', 'D', 'E'].flatMap((row) => Array.from({ length: 12 }, (_, i) => ({ row, number: i + 1, size: 'standard' as const }))),
  ...Array.from({ length: 8 }, (_, i) => ({ row: 'W', number: i + 1, size: 'wide' as const })),
  ...Array.from({ length: 6 }, (_, i) => ({ row: 'M', number: i + 1, size: 'motorcycle' as const })),
]
