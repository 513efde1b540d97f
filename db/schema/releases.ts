import { sql } from 'drizzle-orm'
import { boolean, check, date, index, integer, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { DISPOSITIONS } from '@shared/domain/lifecycle'
import { AUTHORITY_KINDS, CLAIMANT_KINDS, ID_TYPES } from '@shared/schemas/releases'
import { files, propertyItems } from './files'
import { users } from './users'
import { vehicles } from './vehicles'
import { at, createdAt, id } from './columns'

// The release of one vehicle at the counter: who collected it, their ID and its photo, the proof they
// may take it, the odometer, photos and property at release, and the signature. One per vehicle: the
// lifecycle's claimant-ID and signed-release guards read it (server/board/handover.queries.ts).
export const releases = pgTable(
  'releases',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    claimantKind: text({ enum: CLAIMANT_KINDS }),
    claimantName: text(),
    actingFor: text(),
    idType: text({ enum: ID_TYPES }),
    idNumber: text(),
    idIssuer: text(),
    idExpiry: date({ mode: 'string' }),
    idPhotoFileId: uuid().references(() => files.id),
    authorityKind: text({ enum: AUTHORITY_KINDS }),
    authorityReference: text(),
    odometer: integer(),
    odometerUnreadable: boolean().notNull().default(false),
    handoverRecordedAt: at(),
    signatureFileId: uuid().references(() => files.id),
    signerName: text(),
    signedAt: at(),
    createdById: uuid().notNull().references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('releases_vehicle').on(t.vehicleId),
    check('releases_signed_has_image', sql`(${t.signedAt} is null) = (${t.signatureFileId} is null)`),
  ],
)

// Each item of the intake inventory, checked off as handed back (or not, with a note) at release.
export const releaseProperty = pgTable(
  'release_property',
  {
    releaseId: uuid().notNull().references(() => releases.id),
    itemId: uuid().notNull().references(() => propertyItems.id),
    returned: boolean().notNull(),
    note: text(),
  },
  (t) => [uniqueIndex('release_property_item').on(t.releaseId, t.itemId)],
)

// Photos taken at the counter as the vehicle is handed over.
export const releasePhotos = pgTable(
  'release_photos',
  {
    releaseId: uuid().notNull().references(() => releases.id),
    fileId: uuid().notNull().references(() => files.id),
  },
  (t) => [uniqueIndex('release_photos_file').on(t.fileId)],
)

// A gate pass: one vehicle's record-out, once, before it expires. Neither the token in its QR nor its
// typed code is stored: only their SHA-256 (server/releases/gate-keys.ts). A newer pass withdraws older ones.
export const gatePasses = pgTable(
  'gate_passes',
  {
    id: id(),
    vehicleId: uuid().notNull().references(() => vehicles.id),
    releaseId: uuid().notNull().references(() => releases.id),
    disposition: text({ enum: DISPOSITIONS }).notNull(),
    tokenHash: text().notNull().unique(),
    codeHash: text().notNull().unique(),
    issuedById: uuid().notNull().references(() => users.id),
    issuedAt: createdAt(),
    expiresAt: at().notNull(),
    withdrawnAt: at(),
    usedAt: at(),
    usedById: uuid().references(() => users.id),
  },
  (t) => [index('gate_passes_vehicle').on(t.vehicleId), check('gate_passes_expires_after_issued', sql`${t.expiresAt} > ${t.issuedAt}`)],
)
