import { describe, expect, it } from 'vitest'
import { ApiError } from '../../../src/api/http'
import { problemOf } from '../../../src/composables/inspection'

const TORQUE = "A lug-nut torque above 400 ft·lbf is not a real figure; check the maker's specification."
const refusedTorque = () => new ApiError(400, 'Please check lugTorqueFtLbf.', [{ path: 'lugTorqueFtLbf', message: TORQUE }])

describe('problemOf — a refusal in the technician’s words', () => {
  it('problemOf_fieldIssueShownBesideItsField_noPopup', () => {
    expect(problemOf(refusedTorque(), ['lugTorqueFtLbf'])).toBeNull()
  })

  it('problemOf_fieldIssueShownNowhereElse_popupSaysTheIssueNotTheFieldName', () => {
    expect(problemOf(refusedTorque())).toEqual({ title: 'Not saved', reasons: [TORQUE] })
  })

  it('problemOf_severalIssues_popupListsEachMessageOnce_andLeavesOutThoseBesideTheirFields', () => {
    const e = new ApiError(422, 'Not finished.', [
      { path: 'safety', message: 'Read the safety cautions first.' },
      { path: 'rolls', message: 'Answer “Does it roll?” for the pickup.' },
      { path: 'items', message: 'Read the safety cautions first.' },
    ])
    expect(problemOf(e, ['rolls'])).toEqual({ title: 'Not saved', reasons: ['Read the safety cautions first.'] })
  })

  it('problemOf_moveAgainstAnOlderVersion_saysSomeoneElseChangedIt_andToTapAgain', () => {
    const e = new ApiError(409, 'Someone else changed TC-1 a moment ago; The board shows it as it is now.', [], { current: {} })
    expect(problemOf(e)).toEqual({ title: 'Someone else changed this vehicle', reasons: ['Nothing was saved. The page now shows their change: check it, then tap again.'] })
  })

  it('problemOf_otherConflict_keepsTheServersWords_andSaysThePageIsUpToDate', () => {
    const e = new ApiError(409, 'TC-1 is not in Teardown; findings and the estimate are written there.')
    expect(problemOf(e)?.reasons).toEqual(['TC-1 is not in Teardown; findings and the estimate are written there.', 'The page now shows the vehicle as it is.'])
  })

  it('problemOf_noConnection_saysSo', () => {
    const e = new ApiError(0, 'The server cannot be reached. Check the connection and try again.')
    expect(problemOf(e)).toEqual({ title: 'Not saved', reasons: ['The server cannot be reached. Check the connection and try again.'] })
  })
})
