import { describe, expect, it } from 'vitest'
import { cameraProblem } from '../../../src/composables/camera-problems'

const refusal = (name: string) => new DOMException('from the browser', name)

describe('cameraProblem', () => {
  it.each([
    { name: 'NotAllowedError', says: 'not allowed to use the camera' },
    { name: 'SecurityError', says: 'not allowed to use the camera' },
    { name: 'NotFoundError', says: 'No camera was found' },
    { name: 'OverconstrainedError', says: 'No camera was found' },
    { name: 'NotReadableError', says: 'busy or could not be started' },
  ])('cameraProblem_$name_says "$says"', ({ name, says }) => {
    expect(cameraProblem(refusal(name), true)).toContain(says)
  })

  it('cameraProblem_plainHttpPage_asksForHttps (browsers give no camera to an insecure page)', () => {
    expect(cameraProblem(undefined, false)).toContain('HTTPS')
  })

  it('cameraProblem_unknownError_quotesTheBrowser', () => {
    expect(cameraProblem(new Error('device exploded'), true)).toBe('The camera could not be started (device exploded). Type the VIN instead.')
  })
})
