import { mkdirSync } from 'node:fs'
import path from 'node:path'
import { expect, type Locator, type Page } from '@playwright/test'
import type { WalkInStep, WalkInWho } from '../helpers/walk-in'
import { chromiumLaunch } from './chromium'
import { writeQrVideo } from './fake-camera'

// What the counter's browser tests share: the owner's signature on the pad, the gate phone's fake
// camera, the gate's scan and record-out, and a tally of what the people at the counter do.

/**
 * Launch options whose fake camera shows `video` (a Y4M file), for a gate phone. It starts as a QR that
 * is no pass; the test writes the pass's QR into it once the pass exists (Chromium reads the file when
 * the camera starts).
 */
export function fakeCameraLaunch(video: string) {
  mkdirSync(path.dirname(video), { recursive: true })
  writeQrVideo(video, 'no pass yet')
  return {
    ...chromiumLaunch,
    args: [...chromiumLaunch.args, '--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-video-capture=${video}`],
  }
}

/** The owner signs on the counter tablet: strokes drawn on the signature_pad canvas. */
export async function drawSignature(page: Page, pad: Locator) {
  const box = (await pad.boundingBox())!
  await page.mouse.move(box.x + 30, box.y + box.height * 0.7)
  await page.mouse.down()
  for (const [fx, fy] of [[0.2, 0.2], [0.35, 0.75], [0.5, 0.25], [0.65, 0.8], [0.85, 0.35]] as const) await page.mouse.move(box.x + box.width * fx, box.y + box.height * fy, { steps: 8 })
  await page.mouse.up()
}

/** The gate's phone (signed in, on /gate, its camera showing the pass) scans it and records the vehicle out. */
export async function scanAndRecordOut(gate: Page, expected: { stockNumber: string; claimant: string; closedAs: string }, screenshot?: string) {
  await gate.getByTestId('gate-scan').tap()
  const shown = gate.getByTestId('gate-vehicle')
  await expect(shown).toContainText(expected.stockNumber)
  await expect(shown).toContainText(expected.claimant)
  await expect(shown.getByRole('img', { name: 'Photo of the vehicle' })).toBeVisible()
  if (screenshot) await gate.screenshot({ path: screenshot, fullPage: true })
  await gate.getByTestId('gate-record-out').click()
  await expect(gate.getByTestId('gate-done')).toContainText(`${expected.stockNumber} is out: closed as ${expected.closedAs}`)
}

/**
 * Every interaction at the counter, counted as it is made: a click or tap, a field typed in, a key
 * pressed, a file chosen, a signature drawn. Each is noted under the step it belongs to and the person
 * who makes it (the clerk, or the customer on the payment page and the signature pad).
 */
export class CounterTally {
  private readonly counts = new Map<string, number>()
  private step: WalkInStep | undefined
  constructor(private readonly page: Page) {}

  at(step: WalkInStep) {
    this.step = step
    return this
  }

  private note(who: WalkInWho) {
    if (!this.step) throw new Error('CounterTally: say which step first (at)')
    const key = `${who}:${this.step}`
    this.counts.set(key, (this.counts.get(key) ?? 0) + 1)
  }

  async click(target: Locator, who: WalkInWho = 'clerk') {
    await target.click()
    this.note(who)
  }

  async check(target: Locator, who: WalkInWho = 'clerk') {
    await target.check({ force: true })
    this.note(who)
  }

  async fill(target: Locator, value: string, who: WalkInWho = 'clerk') {
    await target.fill(value)
    this.note(who)
  }

  async press(target: Locator, key: string, who: WalkInWho = 'clerk') {
    await target.press(key)
    this.note(who)
  }

  /**
   * A button that opens the tablet's camera (its file input has `capture`), then the picture taken: two.
   * Headless Chromium raises no file chooser for that input (no camera sheet either), so after the
   * click the picture is handed to the input the button opened.
   */
  async chooseFile(button: Locator, input: Locator, file: { name: string; mimeType: string; buffer: Buffer }, who: WalkInWho = 'clerk') {
    await button.click()
    this.note(who)
    await input.setInputFiles(file)
    this.note(who)
  }

  async sign(pad: Locator, who: WalkInWho = 'customer') {
    await drawSignature(this.page, pad)
    this.note(who)
  }

  /** `{ clerk: { find: 2, … }, customer: { … } }`, steps in the order first counted. */
  byStep() {
    const out: Record<WalkInWho, Partial<Record<WalkInStep, number>>> = { clerk: {}, customer: {} }
    for (const [key, n] of this.counts) {
      const [who, step] = key.split(':') as [WalkInWho, WalkInStep]
      out[who][step] = n
    }
    return out
  }
}
