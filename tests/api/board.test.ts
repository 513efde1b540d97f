import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { joinBoardWords } from '@shared/domain/board'
import { sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

type Board = { eventId: string; columns: { column: string; cards: { id: string; state: string }[] }[] }
const idsIn = (b: Board, column: string) => b.columns.find((c) => c.column === column)!.cards.map((c) => c.id)

describe('GET /api/board', () => {
  it('board_columnsInOrder_oldestArrivalFirstAndClosedLeftOut', async () => {
    const staff = await makeStaff(t.db)
    const now = Date.now()
    const newer = await makeVehicle(t.db, staff.yard.id, { arrivedAt: new Date(now - 3_600_000) })
    const older = await makeVehicle(t.db, staff.yard.id, { arrivedAt: new Date(now - 7_200_000) })
    await makeVehicle(t.db, staff.yard.id, { state: 'closed', disposition: 'scrapped', closedAt: new Date() })
    const s = await signedIn(t.app, staff.technician)
    const board = (await s.get('/api/board').expect(200)).body as Board
    expect(board.columns.map((c) => c.column)).toEqual(['arrival', 'teardown', 'decision', 'storage', 'release'])
    expect(idsIn(board, 'arrival')).toEqual([older.id, newer.id])
    expect(board.columns.flatMap((c) => c.cards)).toHaveLength(2)
  })

  it('board_unchangedSinceLastLoad_answers304AndAMoveChangesIt', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id)
    const s = await signedIn(t.app, staff.dispatcher)
    const first = await s.get('/api/board').expect(200)
    const etag = first.headers.etag as string
    expect(etag).toMatch(/^W\//)
    expect((await s.agent.get('/api/board').set('if-none-match', etag)).status).toBe(304)
    await s.post(`/api/vehicles/${v.id}/moves`, { to: 'teardown', version: 1 }).expect(200)
    const after = await s.agent.get('/api/board').set('if-none-match', etag)
    expect(after.status).toBe(200)
    expect(idsIn(after.body as Board, 'teardown')).toEqual([v.id])
  })

  it('board_browserAcceptingGzip_getsTheSameBoardCompressed', async () => {
    const staff = await makeStaff(t.db)
    await makeVehicle(t.db, staff.yard.id)
    const s = await signedIn(t.app, staff.office)
    const plain = await s.agent.get('/api/board').set('accept-encoding', 'identity')
    expect(plain.headers['content-encoding']).toBeUndefined()
    const raw = await s.agent.get('/api/board').set('accept-encoding', 'gzip').buffer(true).parse((res, done) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.on('end', () => done(null, Buffer.concat(chunks)))
    })
    expect(raw.headers['content-encoding']).toBe('gzip')
    // supertest has already inflated it: the same board, byte for byte as JSON.
    expect(JSON.parse((raw.body as Buffer).toString())).toEqual(plain.body)
  })

  // A board of 2,000 cards would carry each card's words 2,000 times: what only the vehicle page shows stays
  // there, and the rule set's words go once for the whole board.
  it('board_cardOfAFloridaTowThatDoesNotRoll_carriesTheBadgeAndDeadlineButNotTheirWorkingsAndItsWordsOnce', async () => {
    const staff = await makeStaff(t.db)
    const v = await makeVehicle(t.db, staff.yard.id, { state: 'storage', rolls: false, steers: true, brakes: true, ruleSetVersionId: await sampleVersion(t.db, 'florida-sample'), arrivedAt: new Date(Date.now() - 2 * 86_400_000) })
    const s = await signedIn(t.app, staff.office)
    type Body = { words?: Record<string, unknown>; columns: { cards: Record<string, Record<string, unknown>>[] }[] }
    const sent = (await s.get('/api/board').expect(200)).body as Body
    const cardIn = (b: Body) => b.columns.flatMap((c) => c.cards).find((c) => c.id === (v.id as unknown))!
    // The rule set's words go once for the board, the card names its own by key.
    const key = (cardIn(sent).summary!.nextDeadline as { words: string }).words
    expect(sent.words![key]).toMatchObject({ label: 'Send the notice of lien by certified mail', es: { label: 'Enviar el aviso de gravamen por correo certificado' } })
    expect(cardIn(sent).summary!.nextDeadline).not.toHaveProperty('label')
    const board = joinBoardWords(structuredClone(sent)) as Body
    expect(board).not.toHaveProperty('words')
    const card = cardIn(board)
    expect(card.pickup).toEqual({ label: expect.any(String), code: expect.any(String), technicianFirst: expect.any(Boolean) })
    expect(card.summary!.nextDeadline).toMatchObject({ code: 'notice-of-lien', citation: expect.stringMatching(/^Fla\. Stat\./) })
    expect(card.summary!.nextDeadline).not.toHaveProperty('rules')
    expect(card.summary).not.toHaveProperty('sampleWarnings')
    // The vehicle page still has all of it.
    const page = (await s.get(`/api/vehicles/${v.id}`).expect(200)).body
    const { rules, ...deadline } = page.summary.nextDeadline
    expect(card.summary!.nextDeadline).toEqual(deadline)
    expect(rules.map((r: { code: string }) => r.code)).toContain('business-days')
    expect(page.summary.sampleWarnings).toBeInstanceOf(Array)
  })

  it('board_signedOut_answers401', async () => {
    expect((await request(t.app).get('/api/board')).status).toBe(401)
  })
})
