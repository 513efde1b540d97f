import { ruleWord, ruleWords } from '@shared/messages/rule-words'
import { createHash } from 'node:crypto'
import type { Database } from '@db/client'
import { notices } from '@db/schema'
import { postalAddress, type ContactRecord } from '@shared/schemas/contacts'
import { formatCode } from '@shared/schemas/owner'
import type { NoticeKind } from '@shared/schemas/notices'
import type { User } from '@shared/schemas/users'
import { contactsOf } from '../contacts/index'
import { badRequest, conflict, fieldIssue, notFound, said } from '../errors'
import { putFiles, recordFiles, type FileStore } from '../files/index'
import { addOwnerLink, newCode, newToken } from '../owner/index'
import { changeVehicle, vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { LETTER_WORDS } from './letter-words'
import { noticeFacts, letterFigures } from './notice-inputs'
import { noticeLetter } from './notice-letter'

export interface NoticeDeps {
  changes: VehicleChanges
  files: FileStore
  /** Days an owner link opens the page; a letter's link lasts at least two weeks past its next date. */
  ownerLinkDays: number
  /** Tells the e-mail worker a message waits. */
  kick?: () => void
}

const DAY_MS = 86_400_000
const RECIPIENT_ROLES: ReadonlySet<ContactRecord['role']> = new Set(['registered_owner', 'lienholder'])

function addressLines(c: ContactRecord): string[] {
  return postalAddress(c) ? [c.street!, `${c.city}, ${c.state} ${c.zip}`] : []
}

/**
 * Makes one letter of `kind` for each recipient — the registered owner and every lienholder unless
 * `contactIds` names others — in the recipient's language, each with an owner link of its own printed
 * as a QR code and a typed code. The PDFs go into the file store first; the links, the notices and
 * the files are then recorded in one change to the vehicle with their history events.
 */
export async function generateNotices(
  deps: NoticeDeps,
  actor: User,
  vehicleId: string,
  input: { kind: NoticeKind; contactIds?: string[] },
  base: string,
  now = new Date(),
): Promise<string[]> {
  const { db } = deps.changes
  const { vehicle, yard } = await vehicleForUser(db, actor.id, vehicleId)
  if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard: it needs no notice now.', said('closedNotice'))
  const facts = await noticeFacts(db, vehicle, yard, now)
  if (!facts) throw conflict('This vehicle has no rule set, so Holdfast cannot tell which notices it needs.', said('noRuleSetNotices'))
  const plan = facts.plan.find((p) => p.kind === input.kind)
  if (!plan) {
    const message = `The rule set asks for no "${LETTER_WORDS.en.title(input.kind)}" for this vehicle.`
    throw badRequest(message, [fieldIssue('kind', 'notices.ruleAsksNoLetter', message, { noticeKind: input.kind })])
  }
  const recipients = await chooseRecipients(db, vehicleId, input.contactIds)
  const figures = await letterFigures(db, vehicle, yard, input.kind, now)
  const site = `${base}/o`
  const expiresAt = new Date(Math.max(now.getTime() + deps.ownerLinkDays * DAY_MS, figures.nextDate ? Date.parse(`${figures.nextDate}T00:00:00Z`) + 14 * DAY_MS : 0))
  const letters = await Promise.all(
    recipients.map(async (c) => {
      const token = newToken()
      const code = newCode()
      const pdf = await noticeLetter({
        kind: input.kind,
        language: c.language,
        date: facts.today,
        yard: { name: yard.name, address: yard.address, phone: yard.phone, hours: yard.hours },
        recipient: { name: c.name, role: c.role, addressLines: addressLines(c) },
        vehicle,
        ...figures,
        dueDate: plan.dueDate,
        // The rule's words in the recipient's language; the statute's section stays as the statute writes it.
        rule: { ...ruleWords({ label: plan.label, citation: plan.citation, es: plan.es }, c.language), ruleSetName: ruleWord(facts.ruleSet, 'name', c.language), ruleSetCaution: ruleWord(facts.ruleSet, 'caution', c.language) },
        owner: { url: `${base}/o/${token}`, site, code: formatCode(code) },
      })
      const data = Buffer.from(pdf)
      return { contact: c, token, code, data, sha256: createHash('sha256').update(data).digest('hex') }
    }),
  )
  const { stored, discard } = await putFiles(
    deps.files,
    vehicleId,
    letters.map((l) => ({
      kind: 'document' as const,
      mime: 'application/pdf' as const,
      ext: 'pdf' as const,
      data: l.data,
      thumb: null,
      width: null,
      height: null,
      sha256: l.sha256,
      label: `${LETTER_WORDS[l.contact.language].title(input.kind)} — ${l.contact.name}`,
    })),
  )
  try {
    const { result } = await changeVehicle(deps.changes, actor, vehicleId, async (scope) => {
      if (scope.vehicle.state === 'closed') throw conflict('This vehicle has left the yard: it needs no notice now.', said('closedNotice'))
      await recordFiles(scope, stored)
      const ids: string[] = []
      for (const [i, l] of letters.entries()) {
        const linkId = await addOwnerLink(scope, { token: l.token, code: l.code, expiresAt, now })
        const [row] = await scope.tx
          .insert(notices)
          .values({
            vehicleId,
            contactId: l.contact.id,
            kind: input.kind,
            language: l.contact.language,
            dueDate: plan.dueDate,
            nextDate: figures.nextDate,
            ownerLinkId: linkId,
            fileId: stored[i]!.id,
            createdById: actor.id,
            createdAt: now,
          })
          .returning({ id: notices.id })
        ids.push(row!.id)
        scope.record({
          kind: 'notice_made',
          after: { noticeId: row!.id, kind: input.kind, contactId: l.contact.id, name: l.contact.name, language: l.contact.language, fileId: stored[i]!.id, sha256: l.sha256, linkId, dueDate: plan.dueDate, nextDate: figures.nextDate },
        })
      }
      return ids
    })
    return result
  } catch (err) {
    await discard()
    throw err
  }
}

async function chooseRecipients(db: Database, vehicleId: string, contactIds: string[] | undefined): Promise<ContactRecord[]> {
  const contacts = await contactsOf(db, vehicleId)
  if (contactIds) {
    const chosen = contactIds.map((id) => contacts.find((c) => c.id === id))
    if (chosen.some((c) => !c)) throw notFound('That contact')
    if (chosen.length === 0) throw badRequest('Choose at least one recipient.', [fieldIssue('contactIds', 'notices.chooseRecipient', 'Choose at least one recipient.')])
    return chosen as ContactRecord[]
  }
  const recipients = contacts.filter((c) => RECIPIENT_ROLES.has(c.role))
  if (recipients.length === 0) {
    const message = 'Add the registered owner or a lienholder first: the notice goes to each of them.'
    throw badRequest(message, [fieldIssue('contactIds', 'notices.addOwnerFirst', message)])
  }
  return recipients
}
