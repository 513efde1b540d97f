import { parseArgs } from 'node:util'
import { createInterface } from 'node:readline/promises'
import { count } from 'drizzle-orm'
import { findUserByEmailInCompany, hashPassword, insertUser, refusingCommonPasswords } from '../users/index'
import { loadConfig } from '../config'
import { companies, yards } from '@db/schema'
import { createUserSchema } from '@shared/schemas/users'
import { yardSetupSchema } from '@shared/schemas/yards'
import { createYard } from '../yards/index'
import { fail, withDatabase } from './open'

const { values } = parseArgs({
  options: {
    email: { type: 'string' },
    name: { type: 'string' },
    role: { type: 'string' },
    company: { type: 'string', default: 'My towing company' },
    'yard-name': { type: 'string' },
    'yard-code': { type: 'string' },
    'yard-address': { type: 'string' },
    'yard-phone': { type: 'string' },
    lat: { type: 'string' },
    lng: { type: 'string' },
    'time-zone': { type: 'string' },
    'rule-set': { type: 'string' },
  },
})

const USAGE = `Usage: npm run user:create -- --email E --name N --role manager|dispatcher|technician|office
  For the company's first yard add: --yard-name NAME --yard-code AB --yard-address ADDRESS
  --lat 36.41 --lng=-119.35 --time-zone America/Los_Angeles [--rule-set california-sample|florida-sample|ordinance-24h-template]`

const wantsYard = values['yard-name'] !== undefined
const yard = wantsYard
  ? yardSetupSchema.safeParse({
      name: values['yard-name'],
      code: values['yard-code'],
      address: values['yard-address'],
      phone: values['yard-phone'],
      lat: values.lat,
      lng: values.lng,
      timeZone: values['time-zone'],
      ruleSet: values['rule-set'],
    })
  : undefined
if (yard && !yard.success) fail(`${USAGE}\n${yard.error.issues.map((i) => `  --yard ${i.path.join('.')}: ${i.message}`).join('\n')}`)

const password = process.env.HOLDFAST_PASSWORD ?? (await ask('Password (at least 10 characters): '))
const parsed = refusingCommonPasswords(createUserSchema).safeParse({ ...values, password })
if (!parsed.success) {
  fail(
    `${USAGE}\n` +
      parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n'),
  )
}
const input = parsed.data

// One call sets up a real yard without the demo: the company, its first manager and its first yard
// are made together or not at all. Before any yard exists, an account without the yard options is
// refused before anything is written (it used to be made, and the second call then failed on it).
await withDatabase(async ({ db }) => {
  const [yards0] = await db.select({ n: count() }).from(yards)
  const firstYard = yards0!.n === 0
  if (firstYard && !yard) fail(`There is no yard yet: give the first manager the yard options in this same command.\n${USAGE}`)
  if (firstYard && input.role !== 'manager') fail('There is no yard yet: the first account sets it up, so make it a manager (--role manager).')
  const [company] = await db.select().from(companies).limit(1)
  const existing = company ? await findUserByEmailInCompany(db, company.id, input.email) : undefined
  // A manager made by the old two-step set-up, before its yard: the second call now adds the yard.
  if (existing && !(firstYard && existing.role === 'manager')) fail(`A user with the e-mail ${input.email} already exists.`)
  await db.transaction(async (tx) => {
    const owner = company ?? (await tx.insert(companies).values({ name: values.company! }).returning())[0]!
    if (existing) console.log(`${existing.email} is already a manager in ${owner.name}; their password is unchanged.`)
    else {
      const user = await insertUser(tx, { ...input, companyId: owner.id, passwordHash: await hashPassword(input.password) })
      console.log(`Created ${user.role} ${user.email} in ${owner.name}.`)
    }
    if (yard?.success) {
      const made = await createYard(tx, owner.id, yard.data, loadConfig().ruleSetsFolder)
      console.log(`Created the yard ${made.name} (stock numbers ${made.code}-…) under ${yard.data.ruleSet}. Start with HOLDFAST_DEMO=0 and sign in.`)
    }
  })
})

async function ask(question: string): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: true })
  try {
    return await rl.question(question)
  } finally {
    rl.close()
  }
}
