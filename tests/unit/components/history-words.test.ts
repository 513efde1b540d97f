// @vitest-environment happy-dom
import { afterAll, describe, expect, it } from 'vitest'
import { HISTORY_KINDS, type HistoryEvent, type HistoryKind } from '../../../shared/schemas/history'
import { fieldValue, historyWords } from '../../../src/components/vehicles/history-words'
import { yardFormat } from '../../../src/composables/yard-time'
import { i18n } from '../../../src/i18n'

// Issue 16 item 7: the history showed "Class standard", lower-case reason codes, "Photo fc62ab2f815d…".
// One entry for every kind the server writes (shared/schemas/history.ts HISTORY_KINDS, the list db/history.ts
// appends from), each with the fields its service records (server/<domain>/*.service.ts, `record({ kind: … })`),
// invented values. A new kind without an entry here fails; every word a person reads is checked for codes.
const ID = '3f1c2a9e-5b7d-4e21-9a0c-7d5e2b8f6a14'
const SHA = 'fc62ab2f815d4c0e9a7b3d5f1e2c4a6b8d0f2e4c6a8b0d2f4e6c8a0b2d4f6e8a'
const AT = '2026-11-30T17:20:00.000Z'
const SAMPLES: Record<HistoryKind, Pick<HistoryEvent, 'before' | 'after'> & Partial<Pick<HistoryEvent, 'reason' | 'fromState' | 'toState'>>> = {
  towed_in: {
    toState: 'arrival',
    reason: 'Private-property tow',
    before: null,
    after: { stockNumber: 'TC-0042', vin: '1G4AH59H45G118341', plate: '7KQM214', vehicle: '2005 Nordsund Fjell Grey', vehicleClass: 'standard', pickup: '1200 Harbor Way, Tamsin Creek', chargeCents: 18500, space: 'B-07', propertyItems: 2, ruleSet: 'Sample — California', ruleSetVersion: 3, alsoOnTheLot: ['TC-0031'], whySeparate: 'Second tow of the same car after a release' },
  },
  corrected: { reason: 'Plate misread at the gate', before: { plate: '7KQM241', vehicleClass: 'heavy' }, after: { plate: '7KQM214', vehicleClass: 'standard' } },
  hold_set: { before: null, after: { holdId: ID, kind: 'law_enforcement', agency: 'Tamsin Creek Police', caseNumber: '26-11873', until: '2026-12-14', note: null } },
  hold_lifted: { reason: 'Released by the detective', before: { holdId: ID, kind: 'law_enforcement', agency: 'Tamsin Creek Police', caseNumber: '26-11873' }, after: null },
  file_added: { before: null, after: { files: [{ id: ID, kind: 'photo', label: null, sha256: SHA }] } },
  space_assigned: { before: { space: null }, after: { space: 'B-07' } },
  moved: { fromState: 'release', toState: 'closed', reason: 'returned to owner', before: null, after: { disposition: 'returned_to_owner', spaceGivenBack: 'B-07' } },
  inspection_started: { before: { inspectedAt: AT, previousInspectionId: ID }, after: { inspectionId: ID, reinspection: true } },
  safety_acknowledged: { before: null, after: { inspectionId: ID, cautions: ['Disconnect the battery before working near the airbags.'] } },
  inspection_item_marked: { before: { item: 'ball-joints', status: 'ok', note: null }, after: { inspectionId: ID, item: 'ball-joints', name: 'Ball joints', status: 'worn', note: 'Under 3 mm' } },
  estimate_line_added: { before: null, after: { inspectionId: ID, lineId: ID, item: 'ball-joints', part: 'Ball joint', quantity: 1, unitPriceCents: 6400, labourHours: 1.5, labourRateCents: 9500 } },
  estimate_line_changed: { before: { item: 'ball-joints', part: 'Ball joint', quantity: 1, unitPriceCents: 6400, labourHours: 1.5, labourRateCents: 9500 }, after: { lineId: ID, item: 'ball-joints', part: 'Ball joint', quantity: 2, unitPriceCents: 6400, labourHours: 2, labourRateCents: 9500 } },
  estimate_line_removed: { before: { lineId: ID, item: 'ball-joints', part: 'Ball joint', quantity: 2, unitPriceCents: 6400, labourHours: 2, labourRateCents: 9500 }, after: null },
  vehicle_values_entered: {
    before: { actualCashValueCents: null, actualCashValueSource: null, salvageValueCents: null, salvageValueSource: null, estimatedValueCents: null },
    after: { inspectionId: ID, actualCashValueCents: 420000, actualCashValueSource: 'Price guide', salvageValueCents: 60000, salvageValueSource: 'Appraisal', estimatedValueCents: 420000 },
  },
  vehicle_value_recorded: { before: { estimatedValueCents: null, estimatedValueSource: null }, after: { estimatedValueCents: 350000, estimatedValueSource: 'Appraisal' } },
  roll_ability_marked: { before: { rolls: null, brakes: null }, after: { inspectionId: ID, rolls: true, brakes: false, pickupNeeds: 'Winch — does not brake' } },
  inspection_finished: { before: null, after: { inspectionId: ID, broken: ['ball-joints'], worn: [], estimateCents: 80000, recommendation: 'repair', pickupNeeds: null } },
  owner_link_created: { before: null, after: { linkId: ID, expiresAt: '2026-12-14T17:20:00.000Z' } },
  owner_link_revoked: { before: { linkId: ID, expiresAt: '2026-12-14T17:20:00.000Z' }, after: null },
  owner_decided: { before: { choice: 'call' }, after: { choice: 'sign_over', signOverTo: 'salvage_buyer', fullName: 'Rosa Delgado', phone: '555-0142', note: null, ip: '203.0.113.7', linkId: ID } },
  payment_taken: { before: null, after: { paymentId: ID, method: 'card', online: true, amountCents: 42500, providerReference: 'pi_demo_0042', dueBeforeCents: 42500, dueAfterCents: 0 } },
  payment_refunded: { reason: 'Charged twice', before: null, after: { paymentId: ID, method: 'check', amountCents: 42500, checkNumber: '1042', refundOfPaymentId: ID } },
  refund_pending: { reason: 'Tow charged twice', before: null, after: { paymentId: ID, method: 'card', amountCents: 2000, providerReference: 're_3Qx8fake0001' } },
  refund_failed: { reason: 'Tow charged twice', before: null, after: { paymentId: ID, method: 'card', amountCents: 2000, providerReference: 're_3Qx8fake0001', failureReason: 'lost_or_stolen_card' } },
  charges_adjusted: { reason: 'Owner was in hospital', before: null, after: { adjustmentId: ID, kind: 'waiver', amountCents: 9000, requestedBy: 'Omar Reyes' } },
  adjustment_requested: { reason: 'Owner was in hospital', before: null, after: { adjustmentId: ID, kind: 'discount', amountCents: 9000 } },
  adjustment_declined: { reason: 'No proof given', before: { adjustmentId: ID, kind: 'discount', amountCents: 9000 }, after: null },
  police_notified: { before: null, after: { notifiedAt: AT, agency: 'Tamsin Creek Police', person: 'Officer Hale', reportNumber: 'R-5521' } },
  contact_added: {
    before: null,
    after: { contactId: ID, role: 'registered_owner', name: 'Rosa Delgado', street: '14 Alder St', city: 'Tamsin Creek', state: 'CA', zip: '95501', phone: null, email: null, language: 'es', source: 'records_request', sourceDate: '2026-11-30' },
  },
  contact_changed: { before: { contactId: ID, role: 'lienholder', source: 'vehicle_papers' }, after: { contactId: ID, role: 'insurer', source: 'counter' } },
  contact_removed: { before: { contactId: ID, role: 'interested_party', name: 'Ada Moss', source: 'other' }, after: null },
  records_requested: { before: null, after: { requestId: ID, agency: 'State DMV', sentOn: '2026-11-30' } },
  records_answered: { before: null, after: { requestId: ID, answeredOn: '2026-12-03', outcome: 'no_record' } },
  notice_made: { before: null, after: { noticeId: ID, kind: 'owner_notice', contactId: ID, name: 'Rosa Delgado', language: 'es', fileId: ID, sha256: SHA, linkId: ID, dueDate: '2026-12-15', nextDate: '2027-01-04' } },
  notice_sent: { before: null, after: { noticeId: ID, sendingId: ID, method: 'certified_mail', to: 'Rosa Delgado', trackingNumber: '9407 1112 0620 1234 5678 90', mailedOn: '2026-12-01' } },
  notice_returned: { before: null, after: { noticeId: ID, sendingId: ID, returnedOn: '2026-12-09', note: 'Moved, left no address' } },
  release_claimant_recorded: {
    before: null,
    after: { claimantKind: 'owner_agent', name: 'Rosa Delgado', actingFor: 'Luis Delgado', idType: 'drivers_license', idIssuer: 'CA', idExpiry: '2031-08-31', idNumberEnds: '4821', authorityKind: 'written_authorisation', authorityReference: 'Letter of 28 Nov' },
  },
  release_id_photo_added: { before: null, after: { fileId: ID, sha256: SHA } },
  release_handover_recorded: { before: null, after: { odometer: 90210, odometerUnreadable: false, returned: ['Child seat'], notReturned: [] } },
  release_photos_added: { before: null, after: { photos: 4 } },
  release_signed: { before: null, after: { signerName: 'Rosa Delgado', fileId: ID, sha256: SHA, remote: true, ip: '203.0.113.7', linkId: ID, at: AT } },
  gate_pass_issued: { before: null, after: { passId: ID, disposition: 'released_to_third_party', expiresAt: '2026-12-02T17:20:00.000Z' } },
  rule_set_changed: { reason: 'County adopted the new rates', before: { ruleSet: 'Sample — California', version: 2 }, after: { ruleSet: 'Sample — California', version: 3 } },
  transfer_recorded: {
    before: null,
    after: { kind: 'lien_sale', buyerKind: 'salvage_buyer', buyerName: 'Harbor Salvage', buyerId: '…7731', priceCents: 80000, date: '2027-01-20', odometer: 90210, proceeds: { dueCents: 61500, appliedCents: 61500, surplusCents: 18500, shortfallCents: 0 }, proceedsPaymentId: ID, proceedsReversedCents: null, odometerDisclosure: false, odometerClause: null },
  },
  transfer_signed: { before: null, after: { kind: 'signed_over', signerName: 'Rosa Delgado', fileId: ID, sha256: SHA } },
  publication_recorded: { before: null, after: { publicationId: ID, newspaper: 'Tamsin Creek Ledger', days: ['2027-01-05', '2027-01-12'] } },
  publication_proof_added: { before: null, after: { publicationId: ID, fileId: ID, sha256: SHA } },
  sale_date_set: { before: { day: '2027-01-20' }, after: { day: '2027-01-27' } },
  clock_step_recorded: { before: { event: 'state-notice-mailed', day: '2026-12-01' }, after: { event: 'state-notice-mailed', day: '2026-12-02', note: null, replaced: true } },
}

const event = (kind: HistoryKind, seq: number): HistoryEvent => ({ seq, at: AT, actor: 'Delia Marsh', kind, fromState: null, toState: null, reason: null, hash: SHA, ...SAMPLES[kind] })

/** Every text of the entry a person reads, one string each. */
function readable(kind: HistoryKind): string[] {
  const shown = yardFormat('America/Los_Angeles')
  const w = historyWords(event(kind, 1), (k, v) => fieldValue(k, v, shown.dateTime))
  return [w.title, w.move, w.reason ?? '', ...w.rows.flatMap((r) => [r.label, r.before ?? '', r.after ?? '']), ...w.files.map((f) => f.name)].filter((s) => s !== '')
}

// What a person would not write: a record id, a digest, a field's own name, a code, an ISO date.
const LEAKS: [string, RegExp][] = [
  ['a uuid', /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i],
  ['a digest', /\b[0-9a-f]{12,}\b/i],
  // A hyphen joins English words too ("rule-set"): a code has two or more ("state-notice-mailed").
  ['a snake_case or kebab-case code', /\b[a-z]+(?:_[a-z]+)+\b|\b[a-z]+(?:-[a-z]+){2,}\b/],
  ['a camelCase field name', /\b[a-z]+[A-Z][A-Za-z]*\b/],
  ['an ISO date or time', /\d{4}-\d{2}-\d{2}/],
  ['a bare lower-case code', /^[a-z]+$/],
]

const before = i18n.global.locale.value
afterAll(() => {
  i18n.global.locale.value = before
})

describe.each(['en', 'es'] as const)('history in %s', (locale) => {
  it.each(HISTORY_KINDS.map((k) => [k]))('%s reads as a person writes it', (kind) => {
    i18n.global.locale.value = locale
    expect(SAMPLES[kind], `no sample for the new kind ${kind}`).toBeDefined()
    const texts = readable(kind)
    expect(texts[0], 'the kind has words of its own').not.toBe(kind)
    expect(texts.flatMap((text) => LEAKS.filter(([, leak]) => leak.test(text)).map(([what]) => `${what}: "${text}"`))).toEqual([])
  })
})

describe('the leak check', () => {
  it('sees a planted code, id and field name', () => {
    const planted = ['law_enforcement', 'state-notice-mailed', ID, 'caseNumber', '2026-11-30', 'standard', SHA.slice(0, 12)]
    for (const text of planted) expect(LEAKS.some(([, leak]) => leak.test(text)), text).toBe(true)
    expect(LEAKS.some(([, leak]) => leak.test('Law enforcement hold'))).toBe(false)
  })
})
