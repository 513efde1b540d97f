// The board's columns in order, then the closed state with its dispositions.
export const BOARD_COLUMNS = ['arrival', 'teardown', 'decision', 'storage', 'release'] as const
export type BoardColumn = (typeof BOARD_COLUMNS)[number]
export const VEHICLE_STATES = [...BOARD_COLUMNS, 'closed'] as const
export type VehicleState = (typeof VEHICLE_STATES)[number]

export const COLUMN_LABELS: Record<VehicleState, string> = {
  arrival: 'Arrival',
  teardown: 'Teardown',
  decision: 'Owner decision',
  storage: 'Storage',
  release: 'Release',
  closed: 'Closed',
}

export const DISPOSITIONS = [
  'returned_to_owner',
  'released_to_third_party',
  'title_transferred',
  'lien_sale',
  'scrapped',
] as const
export type Disposition = (typeof DISPOSITIONS)[number]

export const DISPOSITION_LABELS: Record<Disposition, string> = {
  returned_to_owner: 'Returned to owner',
  released_to_third_party: 'Released to a third party',
  title_transferred: 'Title transferred (yard or salvage buyer)',
  lien_sale: 'Lien sale or disposal',
  scrapped: 'Scrapped',
}
