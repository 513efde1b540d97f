import { eq, inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { releases, titleTransfers, vehicles } from '@db/schema'
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
    .select({ vehicleId: vehicles.id, ...handoverColumns })
    .from(vehicles)
    .leftJoin(releases, eq(releases.vehicleId, vehicles.id))
    .leftJoin(titleTransfers, eq(titleTransfers.vehicleId, vehicles.id))
    .where(inArray(vehicles.id, vehicleIds))
  return new Map(rows.map((r) => [r.vehicleId, handoverFacts(r)]))
}

/**
 * The release's and the transfer's columns behind the handover facts, for a query that left-joins
 * `releases` and `title_transfers` on the vehicle (each has at most one row per vehicle).
 */
export const handoverColumns = {
  claimantKind: releases.claimantKind,
  idNumber: releases.idNumber,
  idPhoto: releases.idPhotoFileId,
  releaseSignedAt: releases.signedAt,
  transferKind: titleTransfers.kind,
  transferSignedAt: titleTransfers.signedAt,
}

type HandoverRow = { claimantKind: string | null; idNumber: string | null; idPhoto: string | null; releaseSignedAt: Date | null; transferKind: string | null; transferSignedAt: Date | null }

/** The handover facts of one row read with `handoverColumns`. */
export function handoverFacts(r: HandoverRow): Required<ReleaseFacts> {
  const transferSigned = r.transferSignedAt !== null
  return {
    claimantIdRecorded: r.claimantKind !== null && r.idNumber !== null && r.idPhoto !== null,
    releaseSigned: r.releaseSignedAt !== null,
    transferSigned: transferSigned && r.transferKind === 'signed_over',
    lienSaleSigned: transferSigned && r.transferKind === 'lien_sale',
  }
}
