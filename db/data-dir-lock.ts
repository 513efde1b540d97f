import { randomBytes } from 'node:crypto'
import { mkdirSync, readdirSync, readFileSync, readlinkSync, renameSync, unlinkSync, writeFileSync } from 'node:fs'
import { hostname } from 'node:os'
import path from 'node:path'

/** Who holds a data directory: enough to tell, after a crash, whether that process still lives. */
interface Holder {
  pid: number
  /** Linux: the process's start time in clock ticks since boot (/proc/<pid>/stat), so a reused PID is not mistaken for it. */
  startTime: string | null
  bootId: string | null
  /** Another PID namespace (a container) cannot be checked from here. */
  pidNamespace: string | null
  host: string
  since: string
}

export class DataDirLockedError extends Error {
  constructor(
    readonly dataDir: string,
    detail = '',
  ) {
    super(
      `The data directory ${dataDir} is in use by another Holdfast process${detail}. ` +
        'Two processes on one embedded database silently lose data, so this one will not start. ' +
        'Stop the other process (or point HOLDFAST_DATA_DIR elsewhere) and try again.',
    )
  }
}

const LOCK_FOLDER = 'holdfast.lock'

/**
 * PGlite takes no lock of its own: two processes on one directory both "work" and lose rows. Each
 * process writes a file naming itself into `holdfast.lock/`, then looks at the others there: one
 * whose process is gone (not running, a zombie, its PID now another process's, or from before a
 * reboot) is removed; one that lives — even stopped or frozen — refuses this start. Writing before
 * looking means two processes starting together cannot both win (at worst both refuse). Nothing
 * here depends on time, so a restart after a crash takes over at once, and a frozen holder is never
 * displaced. A holder on another host or in another container cannot be checked and is left alone.
 */
export function lockDataDir(dataDir: string): () => Promise<void> {
  const folder = path.join(dataDir, LOCK_FOLDER)
  mkdirSync(folder, { recursive: true })
  const self = currentProcess()
  const mine = `${self.pid}-${randomBytes(6).toString('hex')}.json`
  // Complete or absent, never half-written: a rename within the folder.
  const temporary = path.join(folder, `.${mine}.tmp`)
  writeFileSync(temporary, JSON.stringify(self))
  renameSync(temporary, path.join(folder, mine))
  const release = async () => removeIfThere(path.join(folder, mine))

  for (const name of readdirSync(folder)) {
    if (name === mine || !name.endsWith('.json')) continue
    const file = path.join(folder, name)
    const holder = readHolder(file)
    if (holder === 'gone') continue
    const verdict = holder === 'unreadable' ? 'unknown' : judge(holder, self)
    if (verdict === 'dead') {
      removeIfThere(file)
      continue
    }
    removeIfThere(path.join(folder, mine))
    throw new DataDirLockedError(dataDir, describe(holder, verdict, file))
  }
  return release
}

function currentProcess(): Holder {
  return {
    pid: process.pid,
    startTime: procStat(process.pid)?.startTime ?? null,
    bootId: readOrNull(() => readFileSync('/proc/sys/kernel/random/boot_id', 'utf8').trim()),
    pidNamespace: readOrNull(() => readlinkSync('/proc/self/ns/pid')),
    host: hostname(),
    since: new Date().toISOString(),
  }
}

function judge(holder: Holder, self: Holder): 'alive' | 'dead' | 'unknown' {
  if (holder.host !== self.host) return 'unknown'
  if (holder.pidNamespace && self.pidNamespace && holder.pidNamespace !== self.pidNamespace) return 'unknown'
  if (holder.bootId && self.bootId && holder.bootId !== self.bootId) return 'dead'
  try {
    process.kill(holder.pid, 0)
  } catch (err) {
    // EPERM: it exists, under another user.
    if ((err as NodeJS.ErrnoException).code === 'ESRCH') return 'dead'
  }
  const now = procStat(holder.pid)
  if (now && (now.state === 'Z' || now.state === 'X')) return 'dead'
  if (now && holder.startTime && now.startTime !== holder.startTime) return 'dead'
  return 'alive'
}

/** Linux /proc/<pid>/stat: the state (field 3) and start time (field 22); null elsewhere or when it is gone. */
function procStat(pid: number): { state: string; startTime: string } | null {
  return readOrNull(() => {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
    // The command name (field 2) is in parentheses and may hold spaces: count from the last ')'.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
    return { state: fields[0]!, startTime: fields[19]! }
  })
}

function readHolder(file: string): Holder | 'gone' | 'unreadable' {
  try {
    const h = JSON.parse(readFileSync(file, 'utf8')) as Holder
    return Number.isInteger(h.pid) && typeof h.host === 'string' ? h : 'unreadable'
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'ENOENT' ? 'gone' : 'unreadable'
  }
}

function describe(holder: Holder | 'unreadable', verdict: 'alive' | 'unknown', file: string): string {
  if (holder === 'unreadable') return ` (its lock file ${file} cannot be read; if no Holdfast is running on it, delete that file)`
  const who = ` (process ${holder.pid} on ${holder.host}, since ${holder.since})`
  if (verdict === 'alive') return who
  return `${who}, on another machine or container, which cannot be checked from here. If that process is gone, delete ${file}`
}

function removeIfThere(file: string) {
  try {
    unlinkSync(file)
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err
  }
}

function readOrNull<T>(read: () => T): T | null {
  try {
    return read()
  } catch {
    return null
  }
}
