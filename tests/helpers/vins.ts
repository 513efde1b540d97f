import { vinWithCheckDigit } from '@shared/domain/vehicle'

/**
 * A VIN of the same maker and model year as 49 CFR 565's sample (1G4AH59H·5G…, 2005) with a random
 * serial and its check digit computed, so a test that logs two vehicles logs two different ones: the
 * same VIN twice asks the dispatcher why (issue 16, item 14).
 */
export function freshVin(): string {
  const serial = String(Math.floor(Math.random() * 1_000_000)).padStart(6, '0')
  return vinWithCheckDigit(`1G4AH59H5G${serial}`)
}
