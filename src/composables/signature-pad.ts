import type SignaturePad from 'signature_pad'
import { nextTick, onBeforeUnmount, ref, type ShallowRef } from 'vue'

/**
 * A signature drawn on a canvas with signature_pad: the release's claimant or a transfer's seller at
 * the counter, the owner on their own phone. The library loads on the first `start()`, not with the page.
 */
export function useSignaturePad(canvas: Readonly<ShallowRef<HTMLCanvasElement | null>>) {
  const empty = ref(true)
  let pad: SignaturePad | undefined

  // The canvas is drawn at the screen's pixel density so the strokes stay sharp on a tablet.
  function fit() {
    const c = canvas.value
    if (!c || !pad) return
    const ratio = Math.max(window.devicePixelRatio || 1, 1)
    c.width = c.offsetWidth * ratio
    c.height = c.offsetHeight * ratio
    c.getContext('2d')!.scale(ratio, ratio)
    pad.clear()
    empty.value = true
  }

  /** Makes a fresh pad on the canvas once it is on the page. */
  async function start() {
    await nextTick()
    const { default: Pad } = await import('signature_pad')
    pad?.off()
    pad = new Pad(canvas.value!, { penColor: '#1E2B33', minWidth: 1, maxWidth: 3 })
    pad.addEventListener('endStroke', () => (empty.value = pad!.isEmpty()))
    fit()
  }

  function wipe() {
    pad?.clear()
    empty.value = true
  }

  /** The drawing as a PNG data URL, or null while nothing is drawn. */
  function image(): string | null {
    return !pad || pad.isEmpty() ? null : pad.toDataURL('image/png')
  }

  window.addEventListener('resize', fit)
  onBeforeUnmount(() => {
    window.removeEventListener('resize', fit)
    pad?.off()
  })
  return { empty, start, wipe, image }
}
