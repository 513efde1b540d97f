import { describe, expect, it } from 'vitest'
import { addressKey } from '../../../server/session/sign-in-throttle'

describe('addressKey', () => {
  it.each([
    ['IPv4 as it is', '203.0.113.7', '203.0.113.7'],
    ['IPv4-mapped IPv6 as its IPv4 address', '::ffff:203.0.113.7', '203.0.113.7'],
    ['IPv6 by its /64 network', '2001:db8:85a3:1:8a2e:370:7334:1', '2001:db8:85a3:1::/64'],
    ['two addresses of one /64 are one key', '2001:db8:85a3:1::99', '2001:db8:85a3:1::/64'],
    ['a compressed prefix is expanded', '2001:db8::1', '2001:db8:0:0::/64'],
    ['leading zeros do not make another key', '2001:0db8:0000:0001::5', '2001:db8:0:1::/64'],
    ['loopback', '::1', '0:0:0:0::/64'],
  ])('%s', (_name, ip, key) => {
    expect(addressKey(ip)).toBe(key)
  })
})
