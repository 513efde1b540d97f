import { vinWithCheckDigit } from '@shared/domain/vehicle'

let next = Math.floor(Math.random() * 1_000_000)

/**
 * A VIN of the same maker and model year as 49 CFR 565's sample (1G4AH59H·5G…, 2005) with a random
 * serial and its check digit computed, so a test that logs two vehicles logs two different ones: the
 * same VIN twice asks the dispatcher why (issue 16, item 14).
 */
export function freshVin(): string {
  // Counted up from a random start, so one process never repeats a serial (random draws did: a bench's few
  // hundred tow-ins drew the same plate, `8T` + the serial's last digits, and were asked "the same vehicle?").
  next = (next + 1) % 1_000_000
  return vinWithCheckDigit(`1G4AH59H5G${String(next).padStart(6, '0')}`)
}
