import { describe, expect, it } from 'vitest'
import { trackingFromBarcode } from '@shared/domain/notices'

// Invented label data in the shape of a USPS package label (420 + ZIP, then the tracking number).
describe('trackingFromBarcode', () => {
  it('takes the tracking number after 420 and a five-digit ZIP', () => {
    expect(trackingFromBarcode('42093274\u001d9407111206201234567890')).toBe('9407111206201234567890')
  })
  it('takes it after 420 and a ZIP+4', () => {
    expect(trackingFromBarcode('420932741234 9407111206201234567890')).toBe('9407111206201234567890')
  })
  it('keeps a plain tracking number as it is, in capitals', () => {
    expect(trackingFromBarcode('ej958083578us')).toBe('EJ958083578US')
  })
  it('gives null for what is no tracking number', () => {
    expect(trackingFromBarcode('https://example.test/x')).toBeNull()
    expect(trackingFromBarcode('12345')).toBeNull()
  })
})
