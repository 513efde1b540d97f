import { inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { releases, titleTransfers } from '@db/schema'
import type { BoardCard } from '@shared/schemas/board'

export type ReleaseFacts = Partial<Pick<BoardCard['handover'], 'claimantIdRecorded' | 'releaseSigned' | 'transferSigned' | 'lienSaleSigned'>>

/**
 * The release's and the title transfer's share of the handover facts, from their records
 * (server/releases/, server/transfers/): the claimant's ID is recorded once who collects, their ID
 * and a photo of it are; the release is signed once the claimant has signed it (which needs the whole
 * checklist done); a sign-over or a lien sale counts once its bill of sale is signed.
 */
export async function releaseFacts(db: Executor, vehicleIds: string[]): Promise<Map<string, ReleaseFacts>> {
  if (vehicleIds.length === 0) return new Map()
  const rows = await db
    .select({ vehicleId: releases.vehicleId, claimantKind: releases.claimantKind, idNumber: releases.idNumber, idPhoto: releases.idPhotoFileId, signedAt: releases.signedAt })
    .from(releases)
    .where(inArray(releases.vehicleId, vehicleIds))
  const facts = new Map<string, ReleaseFacts>(
    rows.map((r) => [r.vehicleId, { claimantIdRecorded: r.claimantKind !== null && r.idNumber !== null && r.idPhoto !== null, releaseSigned: r.signedAt !== null }]),
  )
  const transfers = await db
    .select({ vehicleId: titleTransfers.vehicleId, kind: titleTransfers.kind, signedAt: titleTransfers.signedAt })
    .from(titleTransfers)
    .where(inArray(titleTransfers.vehicleId, vehicleIds))
  for (const t of transfers) {
    const signed = t.signedAt !== null
    facts.set(t.vehicleId, { ...facts.get(t.vehicleId), transferSigned: signed && t.kind === 'signed_over', lienSaleSigned: signed && t.kind === 'lien_sale' })
  }
  return facts
}
