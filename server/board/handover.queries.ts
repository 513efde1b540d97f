import { inArray } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { releases } from '@db/schema'
import type { BoardCard } from '@shared/schemas/board'

export type ReleaseFacts = Pick<BoardCard['handover'], 'claimantIdRecorded' | 'releaseSigned'>

/**
 * The release's share of the handover facts, from the release records (server/releases/): the
 * claimant's ID is recorded once who collects, their ID and a photo of it are; the release is
 * signed once the claimant has signed it (which needs the whole checklist done).
 */
export async function releaseFacts(db: Executor, vehicleIds: string[]): Promise<Map<string, ReleaseFacts>> {
  if (vehicleIds.length === 0) return new Map()
  const rows = await db
    .select({ vehicleId: releases.vehicleId, claimantKind: releases.claimantKind, idNumber: releases.idNumber, idPhoto: releases.idPhotoFileId, signedAt: releases.signedAt })
    .from(releases)
    .where(inArray(releases.vehicleId, vehicleIds))
  return new Map(
    rows.map((r) => [r.vehicleId, { claimantIdRecorded: r.claimantKind !== null && r.idNumber !== null && r.idPhoto !== null, releaseSigned: r.signedAt !== null }]),
  )
}
