// A process that opens an embedded data directory, writes one row and then just keeps it open, for
// the lock tests to kill (SIGKILL) or freeze (SIGSTOP). Prints "open" once the row is committed and
// it has idled a few seconds like a running server: opening PGlite blocks the event loop, and a lock
// that refreshes itself on a timer (as the former one did, every 5 s) is only fresh after that.
import { sql } from 'drizzle-orm'
import { openDatabase } from '@db/client'

const [dataDir, value] = process.argv.slice(2) as [string, string]
const handle = await openDatabase({ kind: 'pglite', dataDir })
await handle.db.execute(sql`create table if not exists lock_test (value text not null)`)
await handle.db.execute(sql`insert into lock_test (value) values (${value})`)
setTimeout(() => console.log('open'), 6_000)
setInterval(() => {}, 60_000)
