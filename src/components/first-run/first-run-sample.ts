import type { SampleChoice } from '@shared/schemas/first-run'

// US states by postal code, to read a state out of an address ("…, CA 93599") or a sample's
// jurisdiction ("State of California, USA"). Only a suggestion for the first choice: a state missing here
// (the project's word list keeps one out) is simply not suggested, and the manager chooses.
const STATES: Record<string, string> = Object.fromEntries(
  'AL Alabama|AK Alaska|AZ Arizona|AR Arkansas|CA California|CO Colorado|CT Connecticut|DE Delaware|DC District of Columbia|FL Florida|GA Georgia|HI Hawaii|ID Idaho|IL Illinois|IN Indiana|IA Iowa|KS Kansas|KY Kentucky|LA Louisiana|ME Maine|MD Maryland|MA Massachusetts|MI Michigan|MN Minnesota|MS Mississippi|MO Missouri|MT Montana|NE Nebraska|NV Nevada|NH New Hampshire|NJ New Jersey|NM New Mexico|NY New York|NC North Carolina|ND North Dakota|OH Ohio|OK Oklahoma|OR Oregon|PA Pennsylvania|RI Rhode Island|SC South Carolina|SD South Dakota|TN Tennessee|UT Utah|VT Vermont|VA Virginia|WA Washington|WV West Virginia|WI Wisconsin|WY Wyoming'
    .split('|')
    .map((s) => [s.slice(0, 2), s.slice(3)]),
)

// Time zones that lie in one state only. Most US zones (America/Los_Angeles, America/New_York…) span
// several states, so they say nothing about which state's sample fits; Michigan's own zone names a city the
// project's word list keeps out, so it is not listed.
const ONE_STATE_ZONES: [RegExp, string][] = [
  [/^America\/(Phoenix)$/, 'AZ'],
  [/^(Pacific\/Honolulu|US\/Hawaii)$/, 'HI'],
  [/^America\/(Anchorage|Juneau|Sitka|Nome|Yakutat|Metlakatla)$/, 'AK'],
  [/^America\/Indiana\//, 'IN'],
  [/^America\/(Kentucky\/|Louisville$)/, 'KY'],
  [/^America\/North_Dakota\//, 'ND'],
]

const stateOfJurisdiction = (jurisdiction: string) => Object.entries(STATES).find(([, name]) => new RegExp(`\\bState of ${name}\\b`, 'i').test(jurisdiction))?.[0]

/** The state an address names: its full name, or a postal code after a comma ("Orrin Flats, CA 93599"). */
export function stateOfAddress(address: string): string | undefined {
  const code = /,\s*([A-Z]{2})(?:\s+\d{5}(?:-\d{4})?)?\s*(?:,\s*(?:USA|US|United States))?\s*$/.exec(address.trim())?.[1]
  if (code && STATES[code]) return code
  return Object.entries(STATES).find(([, name]) => new RegExp(`,\\s*${name}\\b`, 'i').test(address))?.[0]
}

export const stateOfZone = (timeZone: string) => ONE_STATE_ZONES.find(([zone]) => zone.test(timeZone))?.[1]

/**
 * Which sample a new yard is offered first: the one for the state its address names, else the one for
 * the state its time zone lies in when that zone is one state's only, else the first shipped.
 */
export function defaultSample(samples: SampleChoice[], yard: { address: string; timeZone: string }): string | undefined {
  for (const state of [stateOfAddress(yard.address), stateOfZone(yard.timeZone)]) {
    const match = state && samples.find((s) => stateOfJurisdiction(s.jurisdiction) === state)
    if (match) return match.id
  }
  return samples[0]?.id
}
