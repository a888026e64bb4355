import { ROLE_LABELS, ROLES } from '#shared/auth/roles'

/** The roles as FormSelect choices, in the table's order. */
export const ROLE_OPTIONS = ROLES.map(r => ({ value: r, label: ROLE_LABELS[r] }))
