import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import ts from 'typescript'
import { beforeAll, describe, expect, it } from 'vitest'
import { PERMISSIONS } from '@shared/domain/access'
import { FIELD_WHAT, knownFieldMessages } from '@shared/schemas/field-messages'
import { fieldText } from '@/composables/field-words'
import { i18n, loadMessages } from '@/i18n'

// The shared schemas' messages in the reader's language (issue 14): every message a schema writes has a
// code (`msg('group.key', English, params)`), every code has words in every language naming the same
// parameters, and the English catalog says exactly what the schema says, so the server's English and
// the client's English cannot drift.
const ROOT = join(import.meta.dirname, '../../..')
const SCHEMAS = join(ROOT, 'shared/schemas')
const files = readdirSync(SCHEMAS).filter((f) => f.endsWith('.ts'))
// Read as text: the build's i18n plugin compiles a JSON import into messages, not strings.
type Group = Record<string, string>
const catalog = (locale: string) => (JSON.parse(readFileSync(join(ROOT, `shared/messages/${locale}/fields.json`), 'utf8')) as { fields: Record<string, Group> }).fields
const catalogs = { en: catalog('en'), es: catalog('es') }
const textOf = (c: Record<string, Group>, code: string) => {
  const [group, key] = code.split('.') as [string, string]
  return c[group]?.[key]
}

// A schema message is the text zod shows for a check: a check's `error`/`message`, or the message argument of
// a check or of a shared helper that makes one.
const CHECKS = new Set(['min', 'max', 'int', 'positive', 'nonnegative', 'regex', 'refine', 'custom', 'requiredText', 'isoDaySchema', 'uuidSchema'])
function unwrappedMessages(file: string): string[] {
  const source = ts.createSourceFile(file, readFileSync(join(SCHEMAS, file), 'utf8'), ts.ScriptTarget.Latest, true)
  const found: string[] = []
  const isText = (n: ts.Node) => ts.isStringLiteral(n) || ts.isNoSubstitutionTemplateLiteral(n) || ts.isTemplateExpression(n)
  const inMsg = (n: ts.Node) => ts.isCallExpression(n.parent) && n.parent.expression.getText() === 'msg'
  const visit = (n: ts.Node) => {
    if (isText(n) && !inMsg(n)) {
      const p = n.parent
      const named = ts.isPropertyAssignment(p) && ['error', 'message'].includes(p.name.getText())
      const checkArgument = ts.isCallExpression(p) && p.arguments.includes(n as ts.Expression) && CHECKS.has(p.expression.getText().split('.').pop()!)
      // `ctx.addIssue({ …, message: hooked ? msg(…) : msg(…) })` is fine; a bare literal in such a place is not.
      if (named || checkArgument) found.push(`${file}:${source.getLineAndCharacterOfPosition(n.getStart()).line + 1} ${n.getText().slice(0, 60)}`)
    }
    ts.forEachChild(n, visit)
  }
  visit(source)
  return found
}

describe('schema messages have codes', () => {
  it.each(files)('%s writes every message through msg() with a code', (file) => {
    expect(unwrappedMessages(file)).toEqual([])
  })

  it('finds a bare message (the scan itself works)', () => {
    const probe = 'probe.ts'
    const text = "import { z } from 'zod'\nexport const s = z.string().min(1, 'Enter it.').max(9, { error: `Too ${9}` })\n"
    const source = ts.createSourceFile(probe, text, ts.ScriptTarget.Latest, true)
    let bare = 0
    const visit = (n: ts.Node) => {
      if ((ts.isStringLiteral(n) || ts.isTemplateExpression(n)) && (ts.isPropertyAssignment(n.parent) || (ts.isCallExpression(n.parent) && CHECKS.has(n.parent.expression.getText().split('.').pop()!)))) bare++
      ts.forEachChild(n, visit)
    }
    visit(source)
    expect(bare).toBe(2)
  })
})

describe('the field catalogs', () => {
  let written: ReturnType<typeof knownFieldMessages> = []
  beforeAll(async () => {
    // Building every schema writes its messages (msg() remembers each with its code).
    await Promise.all(Object.values(import.meta.glob('../../../shared/schemas/*.ts')).map((load) => load()))
    written = knownFieldMessages()
    await Promise.all([loadMessages('en'), loadMessages('es')])
    // Every schema module and both languages' catalogs: slow on a busy machine.
  }, 60_000)

  it('reads the schemas (the check itself works)', () => {
    expect(written.length).toBeGreaterThan(200)
    expect(written.map(([, w]) => w.code)).toEqual(expect.arrayContaining(['users.enterValidMailAddress', 'common.tooLong', 'common.cannotBeAbove']))
  })

  it.each(['en', 'es'] as const)('every code a schema writes has words in %s', (locale) => {
    expect(written.filter(([, w]) => typeof textOf(catalogs[locale], w.code) !== 'string').map(([m, w]) => `${w.code}: ${m}`)).toEqual([])
  })

  it('every parameter a message uses has a value where a schema writes it', () => {
    const names = (text: string) => [...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!.toLowerCase())
    for (const [message, w] of written) {
      const given = Object.keys(w.params ?? {}).map((k) => k.toLowerCase())
      for (const locale of ['en', 'es'] as const) for (const n of names(textOf(catalogs[locale], w.code) ?? '')) expect(given, `${locale} ${w.code}: ${message}`).toContain(n)
    }
  })

  it('the English catalog says exactly what each schema says', () => {
    i18n.global.locale.value = 'en'
    const differ = written.filter(([message, w]) => fieldText({ message: '(not found)', ...w }) !== message).map(([m, w]) => `${w.code}: ${m}`)
    expect(differ).toEqual([])
  })

  it('every message in Spanish names only parameters the English one names', () => {
    const names = (text: string) => [...new Set([...text.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!.toLowerCase()))].sort()
    for (const [group, keys] of Object.entries(catalogs.en)) for (const [key, text] of Object.entries(keys)) expect(names(catalogs.es[group]![key]!), `${group}.${key}`).toEqual(names(text))
  })

  it('the English words of `what` read as FIELD_WHAT in shared/', () => {
    expect(catalogs.en.what).toEqual(FIELD_WHAT)
  })
})

describe('the fields the server itself refuses', () => {
  // A file that calls fieldIssue(): every 'group.key' literal in it naming a group of the catalog is a code it sends.
  function sources(dir: string): string[] {
    return readdirSync(join(ROOT, dir), { withFileTypes: true }).flatMap((f) =>
      f.isDirectory() ? sources(join(dir, f.name)) : f.name.endsWith('.ts') ? [readFileSync(join(ROOT, dir, f.name), 'utf8')] : [],
    )
  }
  const groups = Object.keys(catalogs.en).filter((g) => g !== 'what')
  // A permission of the access table (server/access.ts: 'billing.write') reads like a code but is none.
  const codes = [...new Set(sources('server').filter((text) => text.includes('fieldIssue(')).flatMap((text) => [...text.matchAll(/'(\w+)\.(\w+)'/g)].filter((m) => groups.includes(m[1]!)).map((m) => `${m[1]}.${m[2]}`)))]
    .filter((c) => !(c in PERMISSIONS))
    .sort()

  it('finds the codes (the scan itself works)', () => {
    expect(codes).toEqual(expect.arrayContaining(['spaces.takenBy', 'spaces.thatTaken', 'releases.checkOffEvery', 'inspections.answerForPickup']))
  })

  it.each(['en', 'es'] as const)('every field code the server sends has words in %s', (locale) => {
    expect(codes.filter((c) => typeof textOf(catalogs[locale], c) !== 'string')).toEqual([])
  })
})

describe('a field message in the reader’s language', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))

  it.each([
    [{ code: 'common.tooLong', params: { max: 60 } }, 'Use menos de 60 caracteres.'],
    [{ code: 'common.enterAsNumber', params: { what: 'year' } }, 'Escriba el año como número.'],
    [{ code: 'common.cannotBeAbove', params: { what: 'odometer', max: '3,000,000' } }, 'La lectura del odómetro no puede ser mayor que 3,000,000.'],
    [{ code: 'inspections.answer', params: { what: 'rolls' } }, 'Responda: ¿rueda?'],
    [{ code: 'inspections.answerForPickup', params: { what: 'rolls' } }, 'Responda “¿Rueda?” para la recogida.'],
    [{ code: 'spaces.takenBy', params: { label: 'B-4', stock: 'TC-2026-00041' } }, 'El espacio B-4 ya tiene TC-2026-00041. Elija otro espacio.'],
    [{ code: 'users.enterValidMailAddress' }, 'Escriba un correo electrónico válido.'],
  ])('%j reads in Spanish as %s', (words, spanish) => {
    i18n.global.locale.value = 'es'
    expect(fieldText({ message: 'English', ...words })).toBe(spanish)
  })

  it('finds a schema message’s code from its English text (a check made in the browser)', async () => {
    const { createUserSchema } = await import('@shared/schemas/users')
    const parsed = createUserSchema.safeParse({ email: 'not an address', name: 'A', role: 'office', password: 'x' })
    const issue = parsed.success ? undefined : parsed.error.issues.find((i) => i.path[0] === 'email')
    i18n.global.locale.value = 'es'
    expect(fieldText({ message: issue!.message })).toBe('Escriba un correo electrónico válido.')
    i18n.global.locale.value = 'en'
    expect(fieldText({ message: issue!.message })).toBe('Enter a valid e-mail address.')
  })

  it('a form shows the browser’s own check beside the field in the reader’s language', async () => {
    const { createUserSchema } = await import('@shared/schemas/users')
    const { useFieldErrors } = await import('@/composables/field-errors')
    const parsed = createUserSchema.safeParse({ email: 'marta en el patio', name: '', role: 'office', password: 'gravel-lantern-harbor' })
    i18n.global.locale.value = 'es'
    const { errors, fromZod } = useFieldErrors()
    fromZod(parsed.error!)
    expect({ ...errors }).toEqual({ email: 'Escriba un correo electrónico válido.', name: 'Escriba un nombre.' })
  })

  it('shows a message no schema wrote (zod’s own) as it came', () => {
    i18n.global.locale.value = 'es'
    expect(fieldText({ message: 'Invalid input: expected string, received number' })).toBe('Invalid input: expected string, received number')
    expect(fieldText({ message: 'Server English', code: 'no.suchCode' })).toBe('Server English')
  })
})
