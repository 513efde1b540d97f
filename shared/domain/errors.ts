/**
 * Every way a computation can refuse its input. The code is for programs (the API maps it to a
 * 400 with the field); the message is written for the person at the counter.
 */
export type DomainErrorCode =
  | 'invalid-instant'
  | 'invalid-time-zone'
  | 'release-before-arrival'
  | 'as-of-before-arrival'
  | 'stay-too-long'
  | 'unknown-vehicle-class'
  | 'unknown-fee'
  | 'fee-before-arrival'
  | 'invalid-amount'
  | 'invalid-coordinates'
  | 'invalid-model-year'
  | 'invalid-vin'
  | 'invalid-date'

export class DomainError extends Error {
  override readonly name = 'DomainError'

  constructor(
    readonly code: DomainErrorCode,
    message: string,
    /** The input field at fault, when there is one, so a form can point at it. */
    readonly field?: string,
  ) {
    super(message)
  }
}
