import { randomUUID } from 'node:crypto'
import type { Database } from '@db/client'
import * as t from '@db/schema'
import type { Role } from '@shared/domain/access'
import { hashPassword } from '../../server/users/passwords'

export const TEST_PASSWORD = 'correct horse battery'
let passwordHash: Promise<string> | undefined

// Yard codes are unique; random two-letter ones collided within a file's few dozen companies.
let yardCount = Math.floor(Math.random() * 17_576)
function nextYardCode() {
  const n = yardCount++ % 17_576
  return 'T' + [676, 26, 1].map((d) => String.fromCharCode(65 + (Math.floor(n / d) % 26))).join('')
}

export async function makeCompany(db: Database, name = 'Test Towing') {
  const [company] = await db.insert(t.companies).values({ name }).returning()
  const code = nextYardCode()
  const [yard] = await db
    .insert(t.yards)
    .values({ companyId: company!.id, name: `${name} yard`, code, address: '1 Test Road', lat: 36.4, lng: -119.35, timeZone: 'America/Los_Angeles' })
    .returning()
  return { company: company!, yard: yard! }
}

export async function makeUser(db: Database, companyId: string, role: Role, overrides: Partial<typeof t.users.$inferInsert> = {}) {
  passwordHash ??= hashPassword(TEST_PASSWORD)
  const email = `${role}-${randomUUID().slice(0, 8)}@test.example`
  const [user] = await db
    .insert(t.users)
    .values({ companyId, email, name: `Test ${role}`, role, passwordHash: await passwordHash, ...overrides })
    .returning()
  return { ...user!, password: TEST_PASSWORD }
}

/** A company with one yard and one user of each role. */
export async function makeStaff(db: Database) {
  const { company, yard } = await makeCompany(db)
  const [manager, dispatcher, technician, office] = await Promise.all(
    (['manager', 'dispatcher', 'technician', 'office'] as const).map((r) => makeUser(db, company.id, r)),
  )
  return { company, yard, manager: manager!, dispatcher: dispatcher!, technician: technician!, office: office! }
}

export async function makeVehicle(db: Database, yardId: string, overrides: Partial<typeof t.vehicles.$inferInsert> = {}) {
  const [v] = await db
    .insert(t.vehicles)
    .values({ yardId, stockNumber: `TST-${randomUUID().slice(0, 8)}`, arrivedAt: new Date(), make: 'Halvard', model: 'Finch', year: 2013, ...overrides })
    .returning()
  return v!
}
