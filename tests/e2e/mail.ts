import { readdir, readFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { parseMail, type ParsedMail } from '../helpers/mime'

/**
 * A message as the app's local SMTP stand-in kept it (`<data dir>/mail/<time>-<id>.eml`, server/fakes/local-smtp.ts).
 * `keptAs` is the id the stand-in answered the app with ("250 Kept as <id>"), which the Outbox shows as the server's
 * answer. scripts/e2e-server.mjs says where the browser tests' server keeps its data, by port.
 */
export async function capturedMail(keptAs: string): Promise<ParsedMail & { raw: Buffer }> {
  const pointer = path.join(tmpdir(), `holdfast-e2e-${process.env.E2E_PORT ?? 3210}.json`)
  const { dataDir } = JSON.parse(await readFile(pointer, 'utf8')) as { dataDir: string }
  const folder = path.join(dataDir, 'mail')
  const name = (await readdir(folder)).find((f) => f.endsWith(`-${keptAs}.eml`))
  if (!name) throw new Error(`No message kept as ${keptAs} in ${folder}`)
  const raw = await readFile(path.join(folder, name))
  return { ...parseMail(raw), raw }
}
