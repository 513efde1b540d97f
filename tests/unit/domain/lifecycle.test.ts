import { describe, expect, it } from 'vitest'
import { checkMove, DISPOSITIONS, type Disposition, type MoveFacts, MOVES, moveOptions, readsBill, VEHICLE_STATES, type VehicleState } from '@shared/domain/lifecycle'
import { ROLES, type Role } from '@shared/domain/access'

const NOW = new Date('2026-12-03T18:00:00Z')
const ZONE = 'America/Los_Angeles'

/** Everything recorded and nothing in the way: only the role and the table decide. */
const clear: MoveFacts = {
  timeZone: ZONE,
  holds: [],
  inspected: true,
  balanceCents: 41_250,
  paidCents: 41_250,
  creditedCents: 0,
  waived: false,
  claimantIdRecorded: true,
  releaseSigned: true,
  transferSigned: true,
  lienSaleSigned: true,
  lienSale: { open: true, date: '2026-11-20', why: 'Open since 2026-11-20.', code: 'open' },
}
const facts = (over: Partial<MoveFacts>): MoveFacts => ({ ...clear, ...over })

const policeHold = { kind: 'law_enforcement' as const, agency: 'Orrin Flats PD', caseNumber: 'OF-26-11873', until: '2026-12-12T20:00:00Z' }

// DESIGN.md's access table and the yard's real moves, written out by hand: the test fails if
// shared/domain/lifecycle/lifecycle.ts lets anyone else make a move or adds a move nobody asked for.
const WHO_MAY: Record<string, Role[]> = {
  'arrival→teardown': ['manager', 'dispatcher', 'technician'],
  'arrival→release': ['manager', 'office'],
  'teardown→decision': ['manager', 'technician'],
  'teardown→arrival': ['manager', 'dispatcher', 'technician'],
  'decision→storage': ['manager', 'office'],
  'decision→release': ['manager', 'office'],
  'decision→teardown': ['manager', 'dispatcher', 'technician'],
  'storage→release': ['manager', 'office'],
  'storage→decision': ['manager', 'office'],
  'storage→closed': ['manager', 'office'],
  'release→storage': ['manager', 'office'],
  'release→closed': ['manager', 'office'],
}
const CLOSING_WITH: Partial<Record<VehicleState, Disposition>> = { storage: 'lien_sale', release: 'returned_to_owner' }

const every = VEHICLE_STATES.flatMap((from) => VEHICLE_STATES.flatMap((to) => ROLES.map((role) => ({ from, to, role }))))

describe('lifecycle: every move × every role', () => {
  it.each(every)('checkMove_$from→$to_as$role_followsTheTable', ({ from, to, role }) => {
    const v = checkMove({ from, to, role, facts: clear, reason: 'owner asked', disposition: to === 'closed' ? CLOSING_WITH[from] : null, now: NOW })
    const may = WHO_MAY[`${from}→${to}`]
    if (!may) {
      expect(v).toMatchObject({ allowed: false, forbidden: false, reasons: [{ code: 'not-a-move' }] })
    } else if (may.includes(role)) {
      expect(v).toEqual({ allowed: true, forbidden: false, reasons: [] })
    } else {
      expect(v).toMatchObject({ allowed: false, forbidden: true, reasons: [{ code: 'role' }] })
    }
  })

  it('checkMove_roleRefused_namesWhoMay', () => {
    const v = checkMove({ from: 'storage', to: 'release', role: 'dispatcher', facts: clear, now: NOW })
    expect(v.reasons[0]!.message).toBe('Only managers and office staff can move a vehicle from Storage to Release.')
  })

  it('checkMove_technicianClosing_isForbiddenWithTheClosingWords', () => {
    const v = checkMove({ from: 'release', to: 'closed', role: 'technician', facts: clear, disposition: 'scrapped', now: NOW })
    expect(v.reasons[0]!.message).toBe('Only managers and office staff can close a vehicle.')
  })

  it.each([
    { from: 'storage' as const, to: 'storage' as const, words: 'It is already in Storage.' },
    { from: 'closed' as const, to: 'release' as const, words: 'It is closed; a closed vehicle does not come back to the board.' },
    { from: 'arrival' as const, to: 'storage' as const, words: 'A vehicle does not go from Arrival to Storage.' },
  ])('checkMove_noSuchMove_$from→$to_saysSo', ({ from, to, words }) => {
    expect(checkMove({ from, to, role: 'manager', facts: clear, now: NOW }).reasons).toEqual([{ code: 'not-a-move', message: words }])
  })
})

describe('lifecycle guards', () => {
  it('holdGuard_policeHold_blocksReleaseNamingAgencyCaseAndDate', () => {
    const v = checkMove({ from: 'storage', to: 'release', role: 'office', facts: facts({ holds: [policeHold] }), now: NOW })
    expect(v).toMatchObject({ allowed: false, forbidden: false })
    expect(v.reasons).toEqual([{ code: 'hold', message: 'Law-enforcement hold (Orrin Flats PD, case OF-26-11873) until 12 Dec — it cannot go to Release.' }])
  })

  it('holdGuard_datePassedButNotLifted_stillBlocksAndSaysSo', () => {
    const v = checkMove({ from: 'decision', to: 'release', role: 'manager', facts: facts({ holds: [{ ...policeHold, until: '2026-11-28T20:00:00Z' }] }), now: NOW })
    expect(v.reasons[0]!.message).toBe('Law-enforcement hold (Orrin Flats PD, case OF-26-11873), set until 28 Nov and not yet lifted — it cannot go to Release.')
  })

  it('holdGuard_dateInAnotherYear_showsTheYear', () => {
    const v = checkMove({ from: 'arrival', to: 'release', role: 'office', facts: facts({ holds: [{ ...policeHold, until: '2027-01-09T20:00:00Z' }] }), now: NOW })
    expect(v.reasons[0]!.message).toContain('until 9 Jan 2027')
  })

  it('holdGuard_twoHolds_giveTwoReasons', () => {
    const lien = { kind: 'lien' as const, agency: null, caseNumber: null, until: null }
    const v = checkMove({ from: 'storage', to: 'release', role: 'office', facts: facts({ holds: [policeHold, lien] }), now: NOW })
    expect(v.reasons.map((r) => r.message)).toEqual([expect.stringContaining('Law-enforcement hold'), 'Lien hold — it cannot go to Release.'])
  })

  it('holdGuard_closing_isBlockedWithClosingWords', () => {
    const dispute = { kind: 'dispute' as const, agency: null, caseNumber: null, until: null }
    const v = checkMove({ from: 'storage', to: 'closed', role: 'manager', disposition: 'lien_sale', facts: facts({ holds: [dispute] }), now: NOW })
    expect(v.reasons).toEqual([{ code: 'hold', message: 'Dispute — it cannot be closed.' }])
  })

  it.each([
    { from: 'arrival' as const, to: 'teardown' as const, role: 'technician' as const },
    { from: 'decision' as const, to: 'storage' as const, role: 'office' as const },
    { from: 'release' as const, to: 'storage' as const, role: 'office' as const },
  ])('holdGuard_$from→$to_isNotBlockedByAHold', ({ from, to, role }) => {
    expect(checkMove({ from, to, role, facts: facts({ holds: [policeHold] }), reason: 'keys found', now: NOW }).allowed).toBe(true)
  })

  it('inspectionGuard_notFinished_keepsItInTeardown', () => {
    const v = checkMove({ from: 'teardown', to: 'decision', role: 'technician', facts: facts({ inspected: false }), now: NOW })
    expect(v.reasons).toEqual([{ code: 'inspection', message: 'The inspection is not finished — the technician finishes it in Teardown first.' }])
  })

  const handOver = (over: Partial<MoveFacts>, disposition: Disposition = 'returned_to_owner') =>
    checkMove({ from: 'release', to: 'closed', role: 'office', disposition, facts: facts(over), now: NOW })

  it.each([
    { why: 'nothing paid', over: { paidCents: 0 }, message: 'Balance unpaid: $412.50 due. Take the payment, or a manager waives it with a reason.' },
    { why: 'part paid', over: { paidCents: 40_000 }, message: 'Balance unpaid: $12.50 due. Take the payment, or a manager waives it with a reason.' },
    { why: 'no rule set', over: { balanceCents: null, paidCents: 0 }, message: 'No rule set bills this vehicle, so its balance cannot be settled.' },
    { why: 'part discounted and part paid', over: { creditedCents: 10_000, paidCents: 30_000 }, message: 'Balance unpaid: $12.50 due. Take the payment, or a manager waives it with a reason.' },
  ])('balanceGuard_$why_refusesTheHandOver', ({ over, message }) => {
    expect(handOver(over).reasons).toEqual([{ code: 'balance', message }])
  })

  it('balanceGuard_discountedAndTheRestPaid_letsItGo', () => {
    expect(handOver({ creditedCents: 1_250, paidCents: 40_000 }).allowed).toBe(true)
  })

  it('balanceGuard_waivedByAManager_letsItGo', () => {
    expect(handOver({ paidCents: 0, waived: true }).allowed).toBe(true)
  })

  it('balanceGuard_releasedToAThirdParty_alsoNeedsTheBalance', () => {
    expect(handOver({ paidCents: 0 }, 'released_to_third_party').reasons.map((r) => r.code)).toEqual(['balance'])
  })

  it('handOverGuards_nothingRecorded_listsEveryMissingStep', () => {
    const v = handOver({ holds: [policeHold], paidCents: 0, claimantIdRecorded: false, releaseSigned: false })
    expect(v.reasons.map((r) => r.code)).toEqual(['hold', 'balance', 'claimant-id', 'release-signed'])
    expect(v.reasons.slice(2).map((r) => r.message)).toEqual(["The claimant's ID is not recorded.", 'The release is not signed.'])
  })

  it('titleTransferGuard_needsTheSignedTransferButNotTheBalanceNorTheReleasesClaimant', () => {
    const fromStorage = (over: Partial<MoveFacts>) =>
      checkMove({ from: 'storage', to: 'closed', role: 'manager', disposition: 'title_transferred', facts: facts({ paidCents: 0, ...over }), now: NOW })
    expect(fromStorage({}).allowed).toBe(true)
    // The buyer and their ID are on the transfer's own record, which must be signed; no release is needed.
    expect(fromStorage({ claimantIdRecorded: false }).allowed).toBe(true)
    expect(fromStorage({ transferSigned: false, claimantIdRecorded: false }).reasons).toEqual([
      { code: 'release-signed', message: 'The title transfer is not signed.' },
    ])
    // A release signed for a hand-over is not a signed transfer: the vehicle cannot be signed over on it,
    // nor on a signed lien sale.
    expect(fromStorage({ releaseSigned: true, transferSigned: false }).reasons.map((r) => r.code)).toEqual(['release-signed'])
    expect(fromStorage({ lienSaleSigned: true, transferSigned: false }).reasons.map((r) => r.code)).toEqual(['release-signed'])
  })

  it('lienSaleGuard_openButSaleNotRecordedAndSigned_refuses; scrapping needs no bill of sale', () => {
    const close = (disposition: Disposition, over: Partial<MoveFacts>) =>
      checkMove({ from: 'storage', to: 'closed', role: 'office', disposition, facts: facts(over), now: NOW })
    expect(close('lien_sale', { lienSaleSigned: false }).reasons).toEqual([
      { code: 'release-signed', message: 'The lien sale is not recorded and signed: record the buyer, the price and the proceeds, then sign the bill of sale.' },
    ])
    // A signed sign-over is not a lien sale's bill of sale.
    expect(close('lien_sale', { lienSaleSigned: false, transferSigned: true }).allowed).toBe(false)
    expect(close('scrapped', { lienSaleSigned: false, transferSigned: false }).allowed).toBe(true)
  })

  const dispose = (lienSale: MoveFacts['lienSale'], disposition: Disposition = 'lien_sale') =>
    checkMove({ from: 'storage', to: 'closed', role: 'office', disposition, facts: facts({ lienSale }), now: NOW })

  it.each(['lien_sale', 'scrapped'] as const)('lienSaleGuard_%s_beforeTheLawAllows_givesTheDate', (disposition) => {
    expect(dispose({ open: false, date: '2027-01-14', why: 'Not before 2027-01-14.', code: 'not-before' }, disposition).reasons).toEqual([
      { code: 'lien-sale', message: 'The law does not allow a lien sale or disposal before 14 Jan 2027.' },
    ])
  })

  it('lienSaleGuard_clockNotStarted_saysWhatStartsIt', () => {
    expect(dispose({ open: false, date: null, why: 'Starts when lien notice mailed is recorded.', code: 'waiting' }).reasons[0]!.message).toBe(
      'The law has not been shown to allow a lien sale or disposal yet. Starts when lien notice mailed is recorded.',
    )
  })

  it('lienSaleGuard_noRuleSet_refuses', () => {
    expect(dispose(null).reasons[0]!.code).toBe('lien-sale')
  })

  it('lienSaleGuard_open_allowsTheSaleWithoutPayment', () => {
    expect(checkMove({ from: 'storage', to: 'closed', role: 'office', disposition: 'lien_sale', facts: facts({ paidCents: 0, releaseSigned: false }), now: NOW }).allowed).toBe(true)
  })

  it('dispositionGuard_closingWithoutOne_asksForIt', () => {
    expect(checkMove({ from: 'release', to: 'closed', role: 'office', facts: clear, now: NOW }).reasons).toEqual([
      { code: 'disposition', message: 'Choose how the vehicle leaves the yard.' },
    ])
  })

  it('dispositionGuard_returnedToOwnerStraightFromStorage_sendsItToReleaseFirst', () => {
    const v = checkMove({ from: 'storage', to: 'closed', role: 'office', disposition: 'returned_to_owner', facts: clear, now: NOW })
    expect(v.reasons).toEqual([
      { code: 'disposition', message: 'From Storage a vehicle leaves only by title transfer, lien sale or scrapping; to hand it over, move it to Release first.' },
    ])
  })

  it.each([null, '', '   '])('reasonGuard_backMoveWithReason%j_asksWhy', (reason) => {
    expect(checkMove({ from: 'storage', to: 'decision', role: 'office', facts: clear, reason, now: NOW }).reasons).toEqual([
      { code: 'reason', message: 'Say why it goes back to Owner decision.' },
    ])
  })
})

describe('moveOptions (the "Move to…" menu)', () => {
  it('moveOptions_heldVehicleInStorage_asOffice_listsEveryWayWithWhyNot', () => {
    const options = moveOptions('storage', 'office', facts({ holds: [policeHold] }), NOW)
    expect(options.map((o) => [o.rule.to, o.disposition, o.allowed, o.reasons.map((r) => r.code)])).toEqual([
      ['release', null, false, ['hold']],
      ['decision', null, true, []],
      ['closed', 'title_transferred', false, ['hold']],
      ['closed', 'lien_sale', false, ['hold']],
      ['closed', 'scrapped', false, ['hold']],
    ])
    expect(options.find((o) => o.rule.to === 'decision')!.rule.back).toBe(true)
  })

  it('moveOptions_arrivalAsTechnician_offersTeardownAndExplainsRelease', () => {
    const options = moveOptions('arrival', 'technician', clear, NOW)
    expect(options.map((o) => [o.rule.to, o.allowed])).toEqual([
      ['teardown', true],
      ['release', false],
    ])
    expect(options[1]!.reasons[0]!.message).toBe('Only managers and office staff can move a vehicle from Arrival to Release.')
  })

  it('moveOptions_closed_offersNothing', () => {
    expect(moveOptions('closed', 'manager', clear, NOW)).toEqual([])
  })
})

describe('readsBill (the server works the bill out only for a move that reads it)', () => {
  const ways = MOVES.flatMap((m) =>
    (m.dispositions ? DISPOSITIONS.filter((d) => m.dispositions![d]) : [null]).map((disposition: Disposition | null) => ({ from: m.from, to: m.to, disposition })),
  )
  // What the server hands the lifecycle when it has not worked the bill out.
  const unbilled = facts({ balanceCents: null, lienSale: null })
  const judged = (w: (typeof ways)[number], f: MoveFacts) => checkMove({ ...w, role: 'manager', facts: f, reason: 'owner asked', now: NOW })

  it.each(ways)('readsBill $from → $to ($disposition): yes exactly when the verdict needs the bill', (w) => {
    if (readsBill(w.from, w.to, w.disposition)) expect(judged(w, unbilled).allowed).toBe(false)
    else expect(judged(w, unbilled)).toEqual(judged(w, clear))
  })

  it('readsBill_handOverAndLienSale_readItAndTheTeardownDoesNot', () => {
    expect(readsBill('release', 'closed', 'returned_to_owner')).toBe(true)
    expect(readsBill('storage', 'closed', 'lien_sale')).toBe(true)
    expect(readsBill('storage', 'closed', 'title_transferred')).toBe(false)
    expect(readsBill('arrival', 'teardown')).toBe(false)
  })
})
