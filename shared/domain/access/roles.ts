export const ROLES = ['manager', 'dispatcher', 'technician', 'office'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  manager: 'Manager',
  dispatcher: 'Dispatcher',
  technician: 'Technician',
  office: 'Office',
}
