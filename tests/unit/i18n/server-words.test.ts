import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import ts from 'typescript'
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { checkMove, type MoveFacts } from '@shared/domain/lifecycle'
import { SPACE_SIZE_WORDS, SPACE_SIZES, spaceFit } from '@shared/domain/vehicle'
import { fieldText } from '@/composables/field-words'
import { reasonText, refusalText } from '@/composables/refusal-words'
import { i18n, loadMessages } from '@/i18n'
import { reasonParams } from '../../../server/errors'

// The server's own refusals and field issues in the reader's language (issue 14): read with the TypeScript
// parser, every issue literal (`{ path, message }`) in server/ is built by fieldIssue(), and every
// badRequest / conflict / unprocessable / new AppError answers a said() code or only coded issues; an
// answer with neither would reach a Spanish reader as the server's English.
const ROOT = join(import.meta.dirname, '../../..')


// The local stand-ins answer as the hosted services do, to the app and not to a person; the environment's
// checks speak to whoever starts the server.
const NOT_PEOPLE = new Set(['server/fakes', 'server/config.ts'])

function files(dir: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true }).flatMap((f) => {
    const path = join(dir, f.name)
    if (NOT_PEOPLE.has(path)) return []
    return f.isDirectory() ? files(path) : f.name.endsWith('.ts') ? [path] : []
  })
}

const REFUSALS = new Set(['badRequest', 'conflict', 'unprocessable'])
// Helpers that pass on what their callers give; the callers are checked (billing's `refusal` requires a said()).
const HELPERS = new Set(['fieldIssue', 'refusalIssue', 'refusal', ...REFUSALS])
const callee = (n: ts.CallExpression | ts.NewExpression) => n.expression.getText()
const isCallTo = (n: ts.Node, name: string): n is ts.CallExpression => ts.isCallExpression(n) && callee(n) === name
const propNames = (o: ts.ObjectLiteralExpression) => o.properties.map((p) => (p.name && ts.isIdentifier(p.name) ? p.name.text : undefined))
const contains = (n: ts.Node, test: (n: ts.Node) => boolean): boolean => test(n) || (ts.forEachChild(n, (c) => contains(c, test) || undefined) ?? false)
const unwrap = (n: ts.Expression): ts.Expression => (ts.isAsExpression(n) || ts.isParenthesizedExpression(n) || ts.isSatisfiesExpression(n) ? unwrap(n.expression) : n)

// A message msg() wrote, there or in the constant it names (declared in the same file).
const msgWritten = (o: ts.ObjectLiteralExpression) =>
  o.properties.some((p) => {
    if (!ts.isPropertyAssignment(p) || p.name.getText() !== 'message') return false
    const value = unwrap(p.initializer)
    if (isCallTo(value, 'msg')) return true
    if (!ts.isIdentifier(value)) return false
    let written = false
    const find = (n: ts.Node) => {
      if (ts.isVariableDeclaration(n) && n.name.getText() === value.text && n.initializer && isCallTo(unwrap(n.initializer), 'msg')) written = true
      ts.forEachChild(n, find)
    }
    find(o.getSourceFile())
    return written
  })

/** What in one source breaks the rule, as `file:line text`. */
export function uncoded(file: string, text: string): string[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true)
  const found: string[] = []
  const where = (n: ts.Node) => `${file}:${source.getLineAndCharacterOfPosition(n.getStart()).line + 1} ${n.getText().replace(/\s+/g, ' ').slice(0, 80)}`
  const declarations = new Map<string, ts.VariableDeclaration>()
  const pushes = new Map<string, ts.Expression[]>()
  const collect = (n: ts.Node) => {
    if (ts.isVariableDeclaration(n) && ts.isIdentifier(n.name)) declarations.set(n.name.text, n)
    if (ts.isCallExpression(n) && ts.isPropertyAccessExpression(n.expression) && n.expression.name.text === 'push' && ts.isIdentifier(n.expression.expression)) {
      const list = n.expression.expression.text
      pushes.set(list, [...(pushes.get(list) ?? []), ...n.arguments])
    }
    ts.forEachChild(n, collect)
  }
  collect(source)

  // Issues whose every element is a fieldIssue(): an array of them, a list only ever pushed them, a map to them.
  const codedIssues = (raw: ts.Expression, seen = new Set<string>()): boolean => {
    const e = unwrap(raw)
    if (ts.isArrayLiteralExpression(e)) return e.elements.every((x) => isCallTo(x, 'fieldIssue') || (ts.isSpreadElement(x) && codedIssues(x.expression, seen)))
    if (ts.isCallExpression(e) && ts.isPropertyAccessExpression(e.expression) && ['map', 'flatMap'].includes(e.expression.name.text)) {
      const fn = e.arguments[0]
      return !!fn && ts.isArrowFunction(fn) && contains(fn.body, (x) => isCallTo(x, 'fieldIssue')) && !contains(fn.body, (x) => ts.isObjectLiteralExpression(x) && propNames(x).includes('message'))
    }
    if (ts.isIdentifier(e) && !seen.has(e.text)) {
      seen.add(e.text)
      const init = declarations.get(e.text)?.initializer
      if (!init) return false
      const list = unwrap(init)
      if (ts.isArrayLiteralExpression(list) && list.elements.length === 0) return (pushes.get(e.text) ?? []).every((x) => isCallTo(x, 'fieldIssue'))
      return codedIssues(init, seen)
    }
    return false
  }
  // A refusal's extra fields: a said() code somewhere in them, or `{ issues }` that are all coded.
  const codedExtra = (raw: ts.Expression | undefined): boolean => {
    if (!raw) return false
    const e = unwrap(raw)
    if (contains(e, (x) => isCallTo(x, 'said'))) return true
    // A refused move carries the lifecycle's reasons, each with its key (refusals.reasons.<key>).
    if (ts.isObjectLiteralExpression(e) && propNames(e).includes('reasons')) return true
    if (ts.isObjectLiteralExpression(e)) {
      const issues = e.properties.find((p) => p.name && ts.isIdentifier(p.name) && p.name.text === 'issues')
      if (issues && ts.isPropertyAssignment(issues)) return codedIssues(issues.initializer)
      if (issues && ts.isShorthandPropertyAssignment(issues)) return codedIssues(issues.name)
    }
    if (ts.isIdentifier(e)) {
      const init = declarations.get(e.text)?.initializer
      return !!init && codedExtra(init)
    }
    return false
  }

  const visit = (n: ts.Node) => {
    // errors.ts's helpers themselves pass on what their callers give (the callers are checked).
    if (ts.isVariableDeclaration(n) && HELPERS.has(n.name.getText())) return
    // An issue literal: only zod's, worded by withFieldWords(), or one whose message a msg() wrote (zod words it the same way).
    if (ts.isObjectLiteralExpression(n) && propNames(n).includes('path') && propNames(n).includes('message') && !isCallTo(n.parent, 'withFieldWords') && !msgWritten(n)) found.push(where(n))
    if (ts.isCallExpression(n) && REFUSALS.has(callee(n))) {
      const [, second] = n.arguments
      const ok = callee(n) === 'badRequest' ? !!second && (codedIssues(second) || contains(second, (x) => isCallTo(x, 'said'))) : codedExtra(second)
      if (!ok) found.push(where(n))
    }
    if (ts.isNewExpression(n) && callee(n) === 'AppError' && !codedExtra(n.arguments?.[2])) found.push(where(n))
    // forbidden() with a sentence of its own needs its code as the second argument.
    if (isCallTo(n, 'forbidden') && n.arguments.length === 1) found.push(where(n))
    // A route's own zod check (`z.uuid({ error: '…' })`) writes its message through msg(), as a shared schema does.
    if (ts.isPropertyAssignment(n) && n.name.getText() === 'error' && (ts.isStringLiteral(n.initializer) || ts.isTemplateExpression(n.initializer) || ts.isNoSubstitutionTemplateLiteral(n.initializer))) {
      const call = n.parent.parent
      if (ts.isCallExpression(call) && call.expression.getText().startsWith('z.')) found.push(where(n))
    }
    ts.forEachChild(n, visit)
  }
  visit(source)
  return found
}

const serverFiles = files('server')

describe('the server words its refusals and field issues', () => {
  it.each(serverFiles)('%s answers codes beside its English', (file) => {
    expect(uncoded(file, readFileSync(join(ROOT, file), 'utf8'))).toEqual([])
  })

  it.each([
    ['an issue literal (and the answer it makes)', "throw badRequest(m, [{ path: 'x', message: m }])", 2],
    ['an issue pushed as a literal', "const issues: Issue[] = []\nissues.push({ path: 'x', message: m })\nthrow badRequest(m, issues)", 2],
    ['a conflict without a code', "throw conflict('Taken.')", 1],
    ['an AppError without a code', "throw new AppError(410, 'Gone.')", 1],
    ['a 422 whose issues are not all coded', "throw unprocessable(m, { issues: [fieldIssue('a', 'spaces.taken', m), other] })", 1],
    ['a badRequest without issues', "throw badRequest('No.')", 1],
    ['a coded refusal', "throw conflict('Taken.', said('taken', { label }))", 0],
    ['a coded refusal with issues', "throw unprocessable(m, said('chooseFile', undefined, { issues: [fieldIssue('files', 'files.chooseOne', m)] }))", 0],
    ['a zod issue a msg() wrote', "ctx.addIssue({ code: 'custom', path: ['to'], message: msg('reports.atMost', m) })", 0],
    ['coded issues pushed', "const issues: Issue[] = []\nissues.push(fieldIssue('x', 'spaces.taken', m))\nthrow badRequest(m, issues)", 0],
    ['coded issues mapped', "throw badRequest(m, found.map((f) => fieldIssue(f.path, 'common.tooLong', m)))", 0],
    ['an AppError with a code', "throw new AppError(410, m, said('linkGone'))", 0],
    ['a forbidden() with a sentence and no code', "throw forbidden('Not you.')", 1],
    ['a route’s zod message not written by msg()', "const id = z.object({ id: z.uuid({ error: 'That is not an id.' }), lang: z.enum(['en'], { error: msg('common.x', 'Choose en.') }) })", 1],
    ['a refused move carrying the lifecycle’s reasons', 'throw unprocessable(message, { reasons: verdict.reasons })', 0],
    ['a zod issue whose message is a constant msg() wrote', "const M = msg('users.commonPassword', m)\nctx.addIssue({ code: 'custom', path: ['p'], message: M })", 0],
    ['a zod issue whose message is a plain constant', "const M = 'Common.'\nctx.addIssue({ code: 'custom', path: ['p'], message: M })", 1],
  ])('finds %s (the scan itself works)', (_name, text, n) => {
    expect(uncoded('probe.ts', text)).toHaveLength(n)
  })
})

describe('the server’s own words read in the reader’s language', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]), 60_000)
  afterEach(() => {
    i18n.global.locale.value = 'en'
  })

  it('a space too small says its sizes; the English catalog says what spaceFit says for every size', () => {
    const fits = SPACE_SIZES.flatMap((size) => ['motorcycle', 'standard', 'heavy'].map((c) => spaceFit(c, size))).filter((f) => !f.fits)
    expect(fits).toHaveLength(3)
    for (const fit of fits) {
      if (fit.fits) continue
      const issue = { message: `Space B-4: ${fit.reason}`, code: 'spaces.tooSmall', params: { label: 'B-4', reason: fit.reason, fitCode: fit.code, ...fit.params } }
      i18n.global.locale.value = 'en'
      expect(fieldText(issue)).toBe(issue.message)
      i18n.global.locale.value = 'es'
      expect(fieldText(issue)).toMatch(/^Espacio B-4: Este vehículo necesita un lugar para (auto|pesados) o uno más grande; este es un lugar para (moto|auto)\.$/)
    }
    expect(Object.keys(SPACE_SIZE_WORDS).map((s) => i18n.global.t(`vehicle.spaceSizes.${s}`, {}, { locale: 'en' }))).toEqual(Object.values(SPACE_SIZE_WORDS))
  })

  it.each([
    [{ code: 'releases.idExpired', params: { date: '2026-11-30' } }, 'Esta identificación venció el 30 nov 2026: no se puede aceptar una identificación vencida. Pida una vigente.'],
    [{ code: 'files.svg', params: { name: 'logo.svg', what: 'photoTypes' } }, 'logo.svg: No se aceptan dibujos SVG (pueden llevar scripts). Use fotos JPEG, PNG, WebP o HEIC.'],
    [{ code: 'files.pdfPages', params: { name: 'title.pdf', pages: 60, max: 50 } }, 'title.pdf: El PDF tiene 60 páginas; se aceptan como máximo 50. Divídalo en partes.'],
    [{ code: 'transfers.odometerNewer', params: { year: '2035', clause: '49 CFR 580.17(a)(4)' } }, 'Escriba la lectura del odómetro: hay que declarar el millaje, porque un vehículo de modelo 2011 o posterior queda exento solo a partir del 1 de enero de 2035 (49 CFR 580.17(a)(4)).'],
    [
      { code: 'transfers.saleBeforeLaw', params: { date: '2026-12-30', rule: 'Earliest lien sale, Cal. Civ. Code § 3072', ruleEs: 'Primer día para la venta por gravamen, Cal. Civ. Code § 3072', day: '2026-12-20' } },
      'La ley permite la venta por gravamen a partir del 30 dic 2026 (Primer día para la venta por gravamen, Cal. Civ. Code § 3072); el 20 dic 2026 es antes.',
    ],
    [
      { code: 'transfers.saleNotOpen', params: { why: 'Not before 2026-12-30.', gate: 'not-before', date: '2026-12-30' } },
      'Todavía no se ha mostrado que la ley permita la venta por gravamen. No antes del 30 dic 2026.',
    ],
    [
      { code: 'transfers.saleNotOpen', params: { why: 'The rule set sets no lien-sale date for this vehicle.', gate: 'no-sale-date' } },
      'Todavía no se ha mostrado que la ley permita la venta por gravamen. El conjunto de reglas no fija fecha de venta para este vehículo.',
    ],
  ])('%j reads in Spanish', (words, spanish) => {
    i18n.global.locale.value = 'es'
    expect(fieldText({ message: 'English', ...words })).toBe(spanish)
  })

  it('the police told before the tow reads the tow’s time on the yard’s clock (18:30 UTC is 10:30 in Los Angeles in December)', () => {
    i18n.global.locale.value = 'es'
    const text = fieldText({ message: 'English', code: 'policeNotices.notBeforeTow', params: { at: '2026-12-03T18:30:00.000Z', timeZone: 'America/Los_Angeles' } })
    expect(text).toMatch(/^La hora del aviso a la policía no puede ser anterior al arrastre \(.*10:30.*\)\.$/)
  })

  it('a gate pass refused by the lifecycle names each reason with its own parameters, in the order the verdict gives them', () => {
    const facts: MoveFacts = {
      timeZone: 'America/Los_Angeles', holds: [{ kind: 'dispute', agency: null, caseNumber: null, until: null }, { kind: 'lien', agency: null, caseNumber: null, until: null }],
      inspected: true, balanceCents: 12_500, paidCents: 0, creditedCents: 0, waived: false, claimantIdRecorded: true,
      releaseSigned: true, transferSigned: false, lienSaleSigned: false, lienSale: null,
    }
    const verdict = checkMove({ from: 'release', to: 'closed', role: 'office', facts, disposition: 'returned_to_owner' })
    const params = reasonParams(verdict.reasons)
    expect(params.reasons).toBe('holdClose,holdClose,balance')
    i18n.global.locale.value = 'en'
    expect(refusalText('notYetReasons', params, 'English')).toBe(verdict.reasons.map((r) => reasonText(r)).join(' '))
    i18n.global.locale.value = 'es'
    const spanish = refusalText('notYetReasons', params, 'English')
    expect(spanish).toBe(verdict.reasons.map((r) => reasonText(r)).join(' '))
    expect(spanish).toContain(i18n.global.t('lifecycle.holds.dispute'))
    expect(spanish).toContain(i18n.global.t('lifecycle.holds.lien'))
  })
})
