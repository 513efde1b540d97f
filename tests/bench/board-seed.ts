import { sql, type SQL } from 'drizzle-orm'
import { openDatabase, type Database } from '@db/client'

const MAKES = ['Orlan', 'Halvard', 'Kestra', 'Veyland', 'Brisk', 'Stanmore', 'Pellam', 'Corvane', 'Belcourt', 'Nimbus', 'Marrow', 'Dunmore']
const MODELS = ['Sparrow', 'Finch', 'Pip', 'Solace', 'Tundrel', 'Larkin', 'Aster', 'Meridian', 'Trailhand', 'Regatta', 'Ember', 'Homestead']
const COLOURS = ['Silver', 'Blue', 'Black', 'White', 'Green', 'Maroon', 'Grey', 'Red', 'Beige', 'Tan']
const pgArray = (items: string[]) => sql.raw(`array[${items.map((s) => `'${s}'`).join(',')}]`)

// Both drivers answer a raw query with { rows }.
async function rows<T>(db: Database, query: SQL): Promise<T[]> {
  return ((await db.execute(query)) as unknown as { rows: T[] }).rows
}

/**
 * Tops the demo yard up to `active` vehicles on the board and adds `closed` ones to the archive:
 * one INSERT … SELECT generate_series per table, so 50,000 rows take seconds, not minutes.
 */
export async function seedBigYard(dataDir: string, counts: { active: number; closed: number }) {
  const handle = await openDatabase({ kind: 'pglite', dataDir })
  try {
    const db = handle.db
    const [yard] = await rows<{ id: string; code: string }>(db, sql`select id, code from yards order by created_at limit 1`)
    const [version] = await rows<{ v: string }>(db, sql`select rule_set_version_id as v from vehicles where rule_set_version_id is not null limit 1`)
    const [existing] = await rows<{ n: number }>(db, sql`select count(*)::int as n from vehicles where state <> 'closed'`)
    if (!yard || !version || !existing) throw new Error('the demo yard is not loaded')
    const toAdd = Math.max(0, counts.active - existing.n)
    const pick = (list: string[], i: string) => sql`(${pgArray(list)})[1 + (${sql.raw(i)} % ${list.length})]`
    // Weighted like a busy yard: most of the lot sits in Storage.
    const stateOf = sql.raw(`(array['arrival','arrival','teardown','decision','storage','storage','storage','storage','release','release'])[1 + (i % 10)]`)
    await db.execute(sql`
      insert into vehicles (yard_id, stock_number, plate, plate_state, year, make, model, colour, vehicle_class, state, rule_set_version_id, arrived_at, inspected_at, rolls)
      select ${yard.id}, ${yard.code} || '-2025-' || lpad(i::text, 6, '0'), 'B' || lpad(i::text, 6, '0'), 'CA', 1998 + (i % 27),
             ${pick(MAKES, 'i')}, ${pick(MODELS, 'i / 3')}, ${pick(COLOURS, 'i / 7')}, 'standard', ${stateOf}, ${version.v},
             now() - ((1 + i % 90) || ' days')::interval - ((i % 24) || ' hours')::interval,
             case when ${stateOf} in ('decision', 'storage', 'release') then now() - interval '1 day' end,
             i % 5 <> 0
      from generate_series(1, ${toAdd}) as i`)
    await db.execute(sql`
      insert into vehicles (yard_id, stock_number, plate, plate_state, year, make, model, colour, vehicle_class, state, disposition, rule_set_version_id, arrived_at, closed_at, inspected_at)
      select ${yard.id}, ${yard.code} || '-2024-' || lpad(i::text, 6, '0'), 'C' || lpad(i::text, 6, '0'), 'CA', 1995 + (i % 30),
             ${pick(MAKES, 'i')}, ${pick(MODELS, 'i / 5')}, ${pick(COLOURS, 'i / 11')}, 'standard', 'closed',
             (array['returned_to_owner','released_to_third_party','title_transferred','lien_sale','scrapped'])[1 + (i % 5)], ${version.v},
             now() - ((40 + i % 700) || ' days')::interval, now() - ((i % 700) || ' days')::interval, now() - ((39 + i % 700) || ' days')::interval
      from generate_series(1, ${counts.closed}) as i`)
    await db.execute(sql`
      insert into tows (vehicle_id, reason, arrived_at, charge_cents)
      select v.id, (array['breakdown','accident','private_property','law_enforcement','owner_request','repossession'])[1 + (abs(hashtext(v.id::text)) % 6)], v.arrived_at, 19500 + (abs(hashtext(v.id::text)) % 20000)
      from vehicles v left join tows t on t.vehicle_id = v.id where t.id is null`)
    await db.execute(sql`
      insert into holds (vehicle_id, kind, agency, case_number, until)
      select id, 'law_enforcement', 'Orrin Flats Police Department', 'OF-25-' || right(stock_number, 5), now() + interval '10 days'
      from vehicles where stock_number like ${`${yard.code}-2025-%`} and right(stock_number, 2) = '17'`)
    // The embedded database runs no autovacuum: without fresh statistics the planner would walk
    // 52,000 rows one index probe at a time.
    await db.execute(sql`analyze`)
    const after = await rows<{ state: string; n: number }>(db, sql`select state, count(*)::int as n from vehicles group by state order by state`)
    return Object.fromEntries(after.map((r) => [r.state, r.n]))
  } finally {
    await handle.close()
  }
}
