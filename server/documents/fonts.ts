import { readFile } from 'node:fs/promises'
import { createRequire } from 'node:module'
import path from 'node:path'

export type FontName = 'regular' | 'medium' | 'bold'

// The shipped Barlow TTFs (SIL OFL). Read by path: the package's index is for React Native, and a WOFF2
// font crashes the process from a timer inside fontkit (STACK.md).
const FILES: Record<FontName, string> = {
  regular: '400Regular/Barlow_400Regular.ttf',
  medium: '500Medium/Barlow_500Medium.ttf',
  bold: '700Bold/Barlow_700Bold.ttf',
}

let loaded: Promise<Record<FontName, Uint8Array>> | undefined

/** The font files' bytes, read once per process. */
export function barlow(): Promise<Record<FontName, Uint8Array>> {
  loaded ??= (async () => {
    const dir = path.dirname(createRequire(import.meta.url).resolve('@expo-google-fonts/barlow/package.json'))
    const entries = await Promise.all(
      (Object.keys(FILES) as FontName[]).map(async (name) => [name, new Uint8Array(await readFile(path.join(dir, FILES[name])))] as const),
    )
    return Object.fromEntries(entries) as Record<FontName, Uint8Array>
  })()
  return loaded
}

// What pdf-lib asks of fontkit: `create(bytes)` gives a font whose `layout(text, features)` it reads.
interface FontkitLike {
  create(data: Uint8Array, postscriptName?: string): unknown
}
interface LayoutFont {
  layout(text: string, features?: unknown): unknown
}

// Most of a document's time went to fontkit, not to pdf-lib: every document parsed each font afresh
// (its GSUB/GPOS tables are decoded lazily, per font object), and every width measured and every line
// drawn ran the shaping again. A font object is read-only once parsed, and pdf-lib keeps each
// document's subset in its own embedder (`font.createSubset()`), so one parsed font per file serves
// every document; the same string shaped by the same font gives the same glyphs, so layouts are kept
// too (a bounded number: names and addresses vary). The bytes and glyphs written are unchanged.
const LAYOUTS_KEPT = 20_000
const parsed = new WeakMap<Uint8Array, unknown>()

/** fontkit with one parsed font per font file and its layouts remembered, for `doc.registerFontkit`. */
export function sharedFontkit(fontkit: FontkitLike): FontkitLike {
  return {
    create(data, postscriptName) {
      const known = parsed.get(data)
      if (known) return known
      const font = fontkit.create(data, postscriptName) as LayoutFont
      const layout = font.layout.bind(font)
      const layouts = new Map<string, unknown>()
      font.layout = (text, features) => {
        if (features !== undefined) return layout(text, features)
        const kept = layouts.get(text)
        if (kept) return kept
        const run = layout(text)
        if (layouts.size >= LAYOUTS_KEPT) layouts.clear()
        layouts.set(text, run)
        return run
      }
      parsed.set(data, font)
      return font
    },
  }
}
