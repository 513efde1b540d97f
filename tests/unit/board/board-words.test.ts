import { describe, expect, it } from 'vitest'
import { joinBoardWords, splitWords } from '@shared/domain/board'

const deadline = (dueDate: string) => ({ code: 'notice-of-lien', label: 'Send the notice', citation: 'Stat. § 1', es: { label: 'Enviar el aviso' }, dueDate, daysLeft: 3 })
const police = { label: 'Tell the police', es: { label: 'Avisar a la policía' }, source: { citation: 'Code § 2' }, status: 'open', minutesLeft: 40 }
const card = (id: string, dueDate: string) => ({ id, summary: { daysOnLot: 2, nextDeadline: deadline(dueDate), policeNotice: police } })

describe('board words', () => {
  it('split_twoCardsOfOneRuleSetStep_nameTheSameWordsOnceAndJoinBackToTheCards', () => {
    const texts = new Map<string, string>()
    const keyOf = (text: string) => texts.get(text) ?? (texts.set(text, `w${texts.size + 1}`), `w${texts.size}`)
    const cards = [card('a', '2026-12-01'), card('b', '2026-12-09')]
    const sent = cards.map((c) => splitWords(c, keyOf))
    // Two distinct texts (the deadline's, the police clock's), whatever the number of cards.
    expect(texts.size).toBe(2)
    expect(sent[0]!.summary.nextDeadline).toEqual({ code: 'notice-of-lien', dueDate: '2026-12-01', daysLeft: 3, words: 'w1' })
    expect(sent[1]!.summary.policeNotice).toEqual({ status: 'open', minutesLeft: 40, words: 'w2' })
    // The cards given are not changed.
    expect(cards[0]).toEqual(card('a', '2026-12-01'))
    const words = Object.fromEntries([...texts].map(([text, key]) => [key, JSON.parse(text)]))
    const body = JSON.parse(JSON.stringify({ words, columns: [{ cards: sent }] }))
    expect(joinBoardWords(body)).toEqual({ columns: [{ cards }] })
  })

  it('split_aCardWithNoSummaryOrNoDeadline_isSentAsItIs', () => {
    const keyOf = () => 'w1'
    expect(splitWords({ id: 'a', summary: null }, keyOf)).toEqual({ id: 'a', summary: null })
    expect(splitWords({ id: 'a', summary: { nextDeadline: null, policeNotice: null } }, keyOf)).toEqual({ id: 'a', summary: { nextDeadline: null, policeNotice: null } })
  })

  it('join_aBoardWithoutWords_isLeftAsItIs', () => {
    const board = { columns: [{ cards: [card('a', '2026-12-01')] }] }
    expect(joinBoardWords(structuredClone(board))).toEqual(board)
  })
})
