import { parseArgs } from 'node:util'
import { createInterface } from 'node:readline/promises'
import { count } from 'drizzle-orm'
import { companies } from '../../db/schema/index'
import { createUserSchema } from '../../shared/schemas/users'
import { hashPassword } from '../users/passwords'
import { findUserByEmail, insertUser } from '../users/users.queries'
import { fail, withDatabase } from './open'

const { values } = parseArgs({
  options: {
    email: { type: 'string' },
    name: { type: 'string' },
    role: { type: 'string' },
    company: { type: 'string', default: 'My towing company' },
  },
})

const password = process.env.HOLDFAST_PASSWORD ?? (await ask('Password (at least 10 characters): '))
const parsed = createUserSchema.safeParse({ ...values, password })
if (!parsed.success) {
  fail(
    'Usage: npm run user:create -- --email E --name N --role manager|dispatcher|technician|office\n' +
      parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n'),
  )
}
const input = parsed.data

await withDatabase(async ({ db }) => {
  if (await findUserByEmail(db, input.email)) fail(`A user with the e-mail ${input.email} already exists.`)
  const [n] = await db.select({ n: count() }).from(companies)
  const [company] = n!.n > 0 ? await db.select().from(companies).limit(1) : await db.insert(companies).values({ name: values.company! }).returning()
  const user = await insertUser(db, { ...input, companyId: company!.id, passwordHash: await hashPassword(input.password) })
  console.log(`Created ${user.role} ${user.email} in ${company!.name}.`)
})

async function ask(question: string): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: true })
  try {
    return await rl.question(question)
  } finally {
    rl.close()
  }
}
