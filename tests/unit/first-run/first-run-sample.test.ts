import { describe, expect, it } from 'vitest'
import type { SampleChoice } from '@shared/schemas/first-run'
import { defaultSample, stateOfAddress, stateOfZone } from '@/components/first-run/first-run-sample'

// The first-run page offers the sample of the yard's state when the address or a one-state time zone
// says which; otherwise the first shipped sample. Samples as shipped in server/rule-sets/samples.
const sample = (id: string, jurisdiction: string, timeZone: string): SampleChoice => ({ id, name: id, jurisdiction, timeZone, caution: 'Sample — verify with your local code.', cautionEs: null, nameEs: null })
const SAMPLES = [
  sample('california-sample', 'State of California, USA', 'America/Los_Angeles'),
  sample('florida-sample', 'State of Florida, USA', 'America/New_York'),
  sample('ordinance-24h-template', 'Template — enter your city or county', 'America/Chicago'),
]
const withHawaii = [...SAMPLES, sample('hawaii-sample', 'State of Hawaii, USA', 'Pacific/Honolulu')]

describe('defaultSample', () => {
  it.each([
    ['1480 Quarry Spur Road, Orrin Flats, CA 93599', 'America/Los_Angeles', SAMPLES, 'california-sample'],
    ['12 Dock St, Pensacola, FL 32502', 'America/Chicago', SAMPLES, 'florida-sample'],
    ['12 Dock St, Tampa, Florida, USA', 'America/New_York', SAMPLES, 'florida-sample'],
    // America/New_York spans many states: a New York yard is not given the Florida sample.
    ['5 Canal St, Albany, NY 12207', 'America/New_York', SAMPLES, 'california-sample'],
    ['45 Cinder Ln, Orrin Flats', 'America/New_York', SAMPLES, 'california-sample'],
    // A zone that lies in one state decides when the address does not.
    ['1 Harbor Rd', 'Pacific/Honolulu', withHawaii, 'hawaii-sample'],
    // The address wins over the zone.
    ['9 Bay Rd, Key West, FL', 'Pacific/Honolulu', withHawaii, 'florida-sample'],
  ])('%s in %s → %s', (address, timeZone, samples, expected) => {
    expect(defaultSample(samples, { address, timeZone })).toBe(expected)
  })

  it('no samples → nothing to offer', () => {
    expect(defaultSample([], { address: '', timeZone: 'UTC' })).toBeUndefined()
  })
})

describe('stateOfAddress / stateOfZone', () => {
  it.each([
    ['Orrin Flats, CA 93599', 'CA'],
    ['Orrin Flats, CA 93599-1234, USA', 'CA'],
    ['Springfield, Illinois', 'IL'],
    ['Cape Canaveral', undefined],
    // Two capitals that are not a state are no state.
    ['Unit ZZ, Somewhere, QQ', undefined],
  ])('%s → %s', (address, state) => {
    expect(stateOfAddress(address)).toBe(state)
  })

  it.each([
    ['America/Indiana/Indianapolis', 'IN'],
    ['America/Phoenix', 'AZ'],
    ['America/Los_Angeles', undefined],
    ['America/Chicago', undefined],
  ])('%s → %s', (zone, state) => {
    expect(stateOfZone(zone)).toBe(state)
  })
})
