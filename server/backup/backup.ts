import { createHash, createHmac } from 'node:crypto'
import { chmod, mkdir, readFile, writeFile } from 'node:fs/promises'
import { existsSync } from 'node:fs'
import path from 'node:path'
import { buffer } from 'node:stream/consumers'
import { sql } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { verifyVehicleHistory, type HistoryKey } from '@db/history'
import type { FileStore } from '../files/index'

/**
 * A logical backup: every table of the `public` schema as the JSON PostgreSQL itself writes
 * (`row_to_json`, so numbers, timestamps, bytea and jsonb come back exactly), the uploaded files, and a
 * manifest with each table's row count and checksum, the migrations it was made at, each file's
 * SHA-256 and each company's history checkpoint. The same code reads PGlite and PostgreSQL; a restore
 * goes into a fresh, migrated database of the same version. The history key is not in the backup:
 * it is kept apart, and the restored chains verify only with it.
 */
export const BACKUP_FORMAT = 'holdfast-backup-1'

export interface TableStat {
  rows: number
  /** md5 of the table's rows as text, sorted: equal for equal contents whatever the physical order. */
  checksum: string
}

export interface CompanyCheckpoint {
  companyId: string
  vehicles: number
  events: number
  /** HMAC-SHA-256, under the history key, of every vehicle's sealed head (id, last seq, last hash) in order. */
  checkpoint: string
}

export interface Manifest {
  format: typeof BACKUP_FORMAT
  createdAt: string
  driver: string
  migrations: string[]
  tables: Record<string, TableStat>
  files: Record<string, string>
  checkpoints: CompanyCheckpoint[]
}

type Row = Record<string, unknown>
const rowsOf = async (db: Executor, query: ReturnType<typeof sql>) => ((await db.execute(query)) as unknown as { rows: Row[] }).rows

const ident = (name: string) => {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`unexpected table name ${name}`)
  return sql.raw(`"${name}"`)
}

export async function tableNames(db: Executor): Promise<string[]> {
  const rows = await rowsOf(db, sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`)
  return rows.map((r) => String(r.name))
}

export async function tableStats(db: Executor): Promise<Record<string, TableStat>> {
  const stats: Record<string, TableStat> = {}
  for (const name of await tableNames(db)) {
    const [row] = await rowsOf(db, sql`select count(*)::int as n, coalesce(md5(string_agg(x::text, E'\n' order by x::text)), '') as sum from ${ident(name)} x`)
    stats[name] = { rows: Number(row!.n), checksum: String(row!.sum) }
  }
  return stats
}

async function migrationsOf(db: Executor): Promise<string[]> {
  const rows = await rowsOf(db, sql`select hash from drizzle.__drizzle_migrations order by created_at, hash`)
  return rows.map((r) => String(r.hash))
}

/** One checkpoint per company over its vehicles' sealed heads: a restore must reproduce it exactly. */
export async function companyCheckpoints(db: Executor, key: HistoryKey): Promise<CompanyCheckpoint[]> {
  const rows = await rowsOf(
    db,
    sql`select y.company_id as company, h.vehicle_id as vehicle, h.seq, h.hash from history_heads h join vehicles v on v.id = h.vehicle_id join yards y on y.id = v.yard_id order by y.company_id, h.vehicle_id`,
  )
  const byCompany = new Map<string, Row[]>()
  for (const r of rows) byCompany.set(String(r.company), [...(byCompany.get(String(r.company)) ?? []), r])
  return [...byCompany].map(([companyId, heads]) => {
    const mac = createHmac('sha256', key).update(`holdfast-checkpoint\n${companyId}\n`)
    for (const h of heads) mac.update(`${String(h.vehicle)} ${Number(h.seq)} ${String(h.hash)}\n`)
    return { companyId, vehicles: heads.length, events: heads.reduce((n, h) => n + Number(h.seq), 0), checkpoint: mac.digest('hex') }
  })
}

const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex')

/**
 * Writes a backup of the database and every stored file (from the files folder or the bucket alike)
 * into `outDir` (made; must not exist yet).
 */
export async function makeBackup(db: Database, opts: { files: FileStore; key: HistoryKey; outDir: string; driver: string }): Promise<Manifest> {
  if (existsSync(opts.outDir)) throw new Error(`${opts.outDir} already exists: a backup goes into a new folder.`)
  await mkdir(path.join(opts.outDir, 'tables'), { recursive: true, mode: 0o700 })
  // One snapshot: on PostgreSQL a repeatable-read transaction sees every table at the same instant.
  const manifest = await db.transaction(
    async (tx) => {
      const tables: Record<string, TableStat> = {}
      for (const name of await tableNames(tx)) {
        const [row] = await rowsOf(tx, sql`select coalesce(json_agg(x)::text, '[]') as rows from ${ident(name)} x`)
        await writeFile(path.join(opts.outDir, 'tables', `${name}.json`), String(row!.rows), { mode: 0o600 })
      }
      Object.assign(tables, await tableStats(tx))
      return {
        format: BACKUP_FORMAT,
        createdAt: new Date().toISOString(),
        driver: opts.driver,
        migrations: await migrationsOf(tx),
        tables,
        files: {},
        checkpoints: await companyCheckpoints(tx, opts.key),
      } satisfies Manifest as Manifest
    },
    { isolationLevel: 'repeatable read', accessMode: 'read only' },
  )
  for (const key of await opts.files.list()) {
    const data = await buffer((await opts.files.get(key)).stream)
    const to = path.join(opts.outDir, 'files', ...key.split('/'))
    await mkdir(path.dirname(to), { recursive: true, mode: 0o700 })
    await writeFile(to, data, { mode: 0o600 })
    manifest.files[key] = sha256(data)
  }
  await writeFile(path.join(opts.outDir, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`, { mode: 0o600 })
  // The checkpoints on their own, to keep apart from the backup (print them, mail them to the owner).
  await writeFile(path.join(opts.outDir, 'checkpoints.json'), `${JSON.stringify(manifest.checkpoints, null, 2)}\n`, { mode: 0o600 })
  await chmod(opts.outDir, 0o700)
  return manifest
}

export interface RestoreReport {
  tables: number
  rows: number
  files: number
  vehicles: number
  /** Everything that did not come back equal; empty when the restore is whole. */
  problems: string[]
}

export async function readManifest(backupDir: string): Promise<Manifest> {
  const manifest = JSON.parse(await readFile(path.join(backupDir, 'manifest.json'), 'utf8')) as Manifest
  if (manifest.format !== BACKUP_FORMAT) throw new Error(`${backupDir} is not a Holdfast backup (format ${String(manifest.format)}).`)
  return manifest
}

/**
 * Restores a backup into a fresh, migrated database (no company yet) and its file store, then
 * checks it: row counts and checksums per table, each file's hash, every vehicle's history chain and
 * sealed head under `key`, and each company's checkpoint. Refuses a database of another version.
 */
export async function restoreBackup(db: Database, opts: { backupDir: string; files: FileStore; key: HistoryKey }): Promise<RestoreReport> {
  const manifest = await readManifest(opts.backupDir)
  const migrations = await migrationsOf(db)
  if (migrations.join() !== manifest.migrations.join()) {
    throw new Error(`The backup was made at ${manifest.migrations.length} migrations and this database has ${migrations.length}: restore with the same Holdfast version, then start the new one to migrate.`)
  }
  const [companies] = await rowsOf(db, sql`select count(*)::int as n from companies`)
  if (Number(companies!.n) > 0) throw new Error('The database already holds a yard: a backup is restored into a new, empty data directory.')
  const target = new Set(await tableNames(db))
  await db.transaction(async (tx) => {
    // Rows go in as they were: no foreign-key order to follow, and the history's append-only trigger
    // (which refuses any write but an append by Holdfast) does not fire for a restore.
    await tx.execute(sql`set local session_replication_role = replica`)
    for (const name of Object.keys(manifest.tables)) {
      if (!target.has(name)) throw new Error(`The backup has a table ${name} this database does not.`)
      const json = await readFile(path.join(opts.backupDir, 'tables', `${name}.json`), 'utf8')
      await tx.execute(sql`delete from ${ident(name)}`)
      await tx.execute(sql`insert into ${ident(name)} select * from json_populate_recordset(null::${ident(name)}, ${json}::json)`)
    }
  })
  const problems: string[] = []
  const stats = await tableStats(db)
  for (const [name, want] of Object.entries(manifest.tables)) {
    const got = stats[name]
    if (got?.rows !== want.rows) problems.push(`${name}: ${got?.rows ?? 0} rows restored, ${want.rows} backed up`)
    else if (got.checksum !== want.checksum) problems.push(`${name}: the rows differ from the backup's (checksum)`)
  }
  for (const [rel, hash] of Object.entries(manifest.files)) {
    const from = path.join(opts.backupDir, 'files', ...rel.split('/'))
    const data = existsSync(from) ? await readFile(from) : undefined
    if (!data || sha256(data) !== hash) {
      problems.push(`file ${rel}: missing or changed in the backup`)
      continue
    }
    await opts.files.put(rel, data)
  }
  const vehicles = await rowsOf(db, sql`select id from vehicles order by id`)
  for (const v of vehicles) {
    const check = await verifyVehicleHistory(db, opts.key, String(v.id))
    for (const p of check.problems) problems.push(`vehicle ${String(v.id)}: ${p}`)
  }
  const checkpoints = await companyCheckpoints(db, opts.key)
  if (JSON.stringify(checkpoints) !== JSON.stringify(manifest.checkpoints)) {
    problems.push('the company history checkpoints differ from the backup: the key is not the one the backup was made with, or the history changed')
  }
  const rows = Object.values(stats).reduce((n, s) => n + s.rows, 0)
  return { tables: Object.keys(manifest.tables).length, rows, files: Object.keys(manifest.files).length, vehicles: vehicles.length, problems }
}
