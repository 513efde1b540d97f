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

await withDatabase(async ({ db }) => {
  const [n] = await db.select({ n: count() }).from(companies)
  const [company] = n!.n > 0 ? await db.select().from(companies).limit(1) : await db.insert(companies).values({ name: values.company! }).returning()
  if (await findUserByEmailInCompany(db, company!.id, input.email)) fail(`A user with the e-mail ${input.email} already exists.`)
  const user = await insertUser(db, { ...input, companyId: company!.id, passwordHash: await hashPassword(input.password) })
  console.log(`Created ${user.role} ${user.email} in ${company!.name}.`)
  if (yard?.success) {
    const made = await createYard(db, company!.id, yard.data, loadConfig().ruleSetsFolder)
    console.log(`Created the yard ${made.name} (stock numbers ${made.code}-…) under ${yard.data.ruleSet}.`)
  } else if ((await db.select({ n: count() }).from(yards))[0]!.n === 0) {
    console.log('There is no yard yet: run this again for a manager with --yard-name and the other yard options.')
  }
})

async function ask(question: string): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: true })
  try {
    return await rl.question(question)
  } finally {
    rl.close()
  }
}
