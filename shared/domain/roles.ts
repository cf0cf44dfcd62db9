/** The four kinds of user. Staff (investigator, supervisor) belong to one office. */
export const ROLES = ['complainant', 'investigator', 'supervisor', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const STAFF_ROLES = ['investigator', 'supervisor'] as const satisfies readonly Role[]
export type StaffRole = (typeof STAFF_ROLES)[number]

export const isStaffRole = (role: Role): role is StaffRole => (STAFF_ROLES as readonly Role[]).includes(role)

/** Plain-language names shown in the product. */
export const ROLE_LABELS: Record<Role, string> = {
  complainant: 'Complainant',
  investigator: 'Field investigator',
  supervisor: 'Office supervisor',
  admin: 'System administrator',
}
