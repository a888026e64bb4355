import type { Role } from '../../../shared/auth/roles'

/** The invented demo workshop and its people (not a real business or real people). */
export const DEMO_WORKSHOP = {
  name: 'Brackenfold Bar & Bell Works',
  address: 'Unit 4, Ropewalk Yard, Brackenfold',
  timeZone: 'Europe/London',
  locale: 'en-GB',
}

export const DEMO_PASSWORD = 'tonewright-demo'

export const DEMO_PEOPLE: { email: string, name: string, role: Role }[] = [
  { email: 'owner@tonewright.test', name: 'Ilse Marrow', role: 'owner' },
  { email: 'supervisor@tonewright.test', name: 'Corin Hale', role: 'supervisor' },
  { email: 'bench@tonewright.test', name: 'Juno Parris', role: 'benchmaker' },
  { email: 'office@tonewright.test', name: 'Dace Whitlow', role: 'office' },
]
