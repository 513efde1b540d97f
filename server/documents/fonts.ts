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
