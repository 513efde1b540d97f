import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import ts from 'typescript'
import { describe, expect, it } from 'vitest'

// Every refusal and field issue the server sends from these folders carries its code (issue 14): a refusal
// (`new AppError`, `badRequest`, `conflict`, `unprocessable`, `forbidden` with a sentence of its own) has a
// `said(code)` among its arguments, or reads as coded issues (`fieldIssue(…)`, `summaryOf(issues)`); an issue
// is written with `fieldIssue(path, code, English)`, never as a `{ path, message }` literal. A helper that
// passes its caller's sentence on (`refusal(status, path, message, words)`) is checked where it is called:
// its `words` are typed as a `said()`. Without a code, a Spanish reader gets the server's English.
const ROOT = join(import.meta.dirname, '../../..')
// This half of the server; the other half (files, releases, transfers, spaces, inspections, vehicles,
// police-notices, owner, quotes, access, middleware, errors.ts) is checked by server-words.test.ts.
const OTHERS = ['files', 'releases', 'transfers', 'spaces', 'inspections', 'vehicles', 'police-notices', 'owner', 'quotes', 'middleware', 'access.ts', 'errors.ts']
// The local stand-ins answer as the hosted services do, in their words, to the app and not to a person;
// the environment's checks speak to whoever runs the server.
const NOT_PEOPLE = ['fakes', 'config.ts']

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((f) => {
    const path = join(dir, f.name)
    if (dir === join(ROOT, 'server') && [...OTHERS, ...NOT_PEOPLE].includes(f.name)) return []
    return f.isDirectory() ? files(path) : f.name.endsWith('.ts') ? [path] : []
  })
}

const REFUSALS = new Set(['AppError', 'badRequest', 'conflict', 'unprocessable'])
const CODED = new Set(['said', 'fieldIssue', 'summaryOf'])
// A refused move carries the lifecycle's reasons, each with its key (refusals.reasons.<key>).
const carriesReasons = (n: ts.Node): boolean => (ts.isPropertyAssignment(n) && n.name.getText() === 'reasons') || (ts.forEachChild(n, carriesReasons) ?? false)

/** `file:line text` of each refusal or issue written without a code. */
export function uncoded(name: string, text: string): string[] {
  const source = ts.createSourceFile(name, text, ts.ScriptTarget.Latest, true)
  const found: string[] = []
  const at = (n: ts.Node) => `${name}:${source.getLineAndCharacterOfPosition(n.getStart()).line + 1} ${n.getText().replace(/\s+/g, ' ').slice(0, 80)}`
  const callee = (n: ts.CallExpression | ts.NewExpression) => n.expression.getText().split('.').pop()!
  const callsAny = (n: ts.Node, names: Set<string>): boolean =>
    ((ts.isCallExpression(n) || ts.isNewExpression(n)) && names.has(callee(n))) || (ts.forEachChild(n, (c) => callsAny(c, names) || undefined) ?? false)
  // A helper's sentence is its own parameter: its callers are checked (and typed) instead.
  const parameterOf = (n: ts.Node, id: ts.Node): boolean => {
    for (let p = n.parent; p; p = p.parent) if (ts.isFunctionLike(p) && p.parameters.some((q) => q.name.getText() === id.getText())) return true
    return false
  }
  const visit = (n: ts.Node) => {
    if ((ts.isCallExpression(n) || ts.isNewExpression(n)) && REFUSALS.has(callee(n))) {
      const args = [...(n.arguments ?? [])]
      const sentence = args[callee(n) === 'AppError' ? 1 : 0]
      if (sentence && !(ts.isIdentifier(sentence) && parameterOf(n, sentence)) && !args.some((a) => callsAny(a, CODED) || carriesReasons(a))) found.push(at(n))
    }
    if (ts.isCallExpression(n) && callee(n) === 'forbidden' && n.arguments.length === 1) found.push(at(n))
    // A route's own zod check (`z.uuid({ error: '…' })`) writes its message through msg(), as a shared schema does.
    if (ts.isPropertyAssignment(n) && n.name.getText() === 'error' && (ts.isStringLiteral(n.initializer) || ts.isTemplateExpression(n.initializer) || ts.isNoSubstitutionTemplateLiteral(n.initializer))) {
      const call = n.parent.parent
      if (ts.isCallExpression(call) && call.expression.getText().startsWith('z.')) found.push(at(n))
    }
    if (ts.isObjectLiteralExpression(n)) {
      const prop = (key: string) => n.properties.find((p) => (ts.isPropertyAssignment(p) || ts.isShorthandPropertyAssignment(p)) && p.name.getText() === key)
      const message = prop('message')
      if (prop('path') && message && !prop('code')) {
        const value = ts.isShorthandPropertyAssignment(message) ? message.name : (message as ts.PropertyAssignment).initializer
        const written = ts.isCallExpression(value) && callee(value) === 'msg'
        if (!written && !(ts.isIdentifier(value) && parameterOf(n, value))) found.push(at(n))
      }
    }
    ts.forEachChild(n, visit)
  }
  visit(source)
  return found
}

const sources = files(join(ROOT, 'server'))

describe('server answers carry codes (this half of server/)', () => {
  it('reads this half of the server (the scan itself works)', () => {
    const names = sources.map((f) => relative(ROOT, f))
    expect(names).toEqual(expect.arrayContaining(['server/card-payments/card-payments.service.ts', 'server/billing/payments.service.ts', 'server/publications/publications.service.ts']))
    expect(names.some((f) => f.startsWith('server/releases/') || f.startsWith('server/fakes/'))).toBe(false)
  })

  it('finds each kind of uncoded answer in a planted sample', () => {
    const planted = [
      "throw badRequest('Too early.', [{ path: 'day', message: 'Too early.' }])",
      "throw new AppError(502, `No answer: ${why}`)",
      "throw unprocessable('No sale date.')",
      "throw forbidden('Not you.')",
      "throw conflict(message, { issues: [fieldIssue('day', 'common.x', message)] })",
      "throw unprocessable('No sale date.', said('noSaleDate'))",
      "throw badRequest(summaryOf(issues), issues)",
      "const refusal = (status, path, message) => new AppError(status, message, { issues: [{ path, message }] })",
      "const id = z.object({ id: z.uuid({ error: 'That is not an id.' }), lang: z.enum(['en'], { error: msg('common.x', 'Choose en.') }) })",
    ].join('\n')
    expect(uncoded('planted.ts', planted).map((f) => f.split(' ')[0])).toEqual(['planted.ts:1', 'planted.ts:1', 'planted.ts:2', 'planted.ts:3', 'planted.ts:4', 'planted.ts:9'])
  })

  it('sends every refusal and issue with its code', () => {
    expect(sources.flatMap((f) => uncoded(relative(ROOT, f), readFileSync(f, 'utf8')))).toEqual([])
  })
})
