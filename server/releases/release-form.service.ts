import { eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { files } from '@db/schema'
import { dispositionFor } from '@shared/schemas/releases'
import type { User } from '@shared/schemas/users'
import { moveFacts } from '../board/index'
import { summarizeVehicles } from '../charges/index'
import { gatePass, releaseForm, type Language } from '../documents/index'
import type { FileStore } from '../files/index'
import { spaceOf, vehicleForUser } from '../vehicles/index'
import type { IssuedPass } from './gate-passes.service'
import { propertyAtRelease, releaseOf } from './releases.queries'

async function storedBytes(db: Executor, store: FileStore, fileId: string): Promise<Uint8Array> {
  const [file] = await db.select({ key: files.storageKey }).from(files).where(eq(files.id, fileId))
  const { stream } = await store.get(file!.key)
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(chunk as Buffer)
  return Buffer.concat(chunks)
}

/** The release form as it stands: signed or not, its charges as of the signature (or now). */
export async function releaseFormPdf(db: Executor, store: FileStore, user: User, vehicleId: string, language: Language, now = new Date()) {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const release = await releaseOf(db, vehicleId)
  const asOf = release?.signedAt ?? now
  const summary = (await summarizeVehicles(db, yard, [vehicle], asOf)).get(vehicle.id)
  const facts = await moveFacts(db, vehicle, yard, false, asOf)
  const c = release
  const pdf = await releaseForm(
    {
      yard,
      vehicle,
      claimant:
        c?.claimantKind && c.claimantName && c.idType && c.idNumber && c.idIssuer && c.idExpiry && c.authorityKind && c.authorityReference
          ? { kind: c.claimantKind, name: c.claimantName, actingFor: c.actingFor, idType: c.idType, idNumber: c.idNumber, idIssuer: c.idIssuer, idExpiry: c.idExpiry, authorityKind: c.authorityKind, authorityReference: c.authorityReference }
          : null,
      disposition: vehicle.disposition ?? (c?.claimantKind ? dispositionFor(c.claimantKind) : null),
      odometer: c?.odometer ?? null,
      odometerUnreadable: c?.odometerUnreadable ?? false,
      charges: summary ? { towCents: summary.towCents, storageCents: summary.storageCents, days: summary.daysOnLot, paidCents: facts.paidCents, waived: facts.waived } : null,
      property: await propertyAtRelease(db, vehicleId, c?.id ?? null),
      signature:
        c?.signatureFileId && c.signedAt && c.signerName ? { jpeg: await storedBytes(db, store, c.signatureFileId), signerName: c.signerName, signedAt: c.signedAt } : null,
      printedAt: now,
    },
    language,
  )
  return { pdf, stockNumber: vehicle.stockNumber }
}

/** The gate pass's PDF, made once, as it is issued: its token is in the QR and is never kept. */
export async function gatePassPdf(db: Executor, user: User, vehicleId: string, pass: IssuedPass, base: string, language: Language) {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const release = await releaseOf(db, vehicleId)
  return gatePass(
    {
      yard,
      vehicle,
      space: (await spaceOf(db, vehicle.spaceId))?.label ?? null,
      claimantName: release?.claimantName ?? null,
      disposition: dispositionFor(release!.claimantKind!),
      link: `${base}/g/${pass.token}`,
      code: `${pass.code.slice(0, 5)}-${pass.code.slice(5)}`,
      expiresAt: pass.expiresAt,
    },
    language,
  )
}
