import { describe, expect, it } from 'vitest'
import { can, navItemsFor, permissionForPath, ROLES, type Permission, type Role } from '../../../../shared/auth/roles'

// The expected rights come from the role table in README.md ("Roles and stages"),
// written out here by hand so that a change to the code's table has to be made twice on purpose.
const expected: Record<Permission, Role[]> = {
  'workshop:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'workshop:manage': ['owner'],
  'team:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'team:manage': ['owner'],
  'templates:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'templates:manage': ['owner'],
  'pieces:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'pieces:stage': ['owner', 'supervisor', 'benchmaker'],
  'pieces:assign': ['owner', 'supervisor'],
  'bench:strike': ['owner', 'supervisor', 'benchmaker'],
  'review:decide': ['owner', 'supervisor'],
  // Re-measuring stored strikes is a supervisor's call (issue 10: "a supervisor can re-measure"), and the owner's.
  'strikes:reanalyze': ['owner', 'supervisor'],
  'sets:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'sets:manage': ['owner', 'office'],
  'sets:ship': ['owner', 'office'],
  'lots:manage': ['owner', 'office'],
  'certificates:read': ['owner', 'supervisor', 'office'],
  'certificates:sign': ['owner', 'supervisor'],
  'certificates:send': ['owner', 'office'],
}

describe('can', () => {
  for (const [permission, roles] of Object.entries(expected) as [Permission, Role[]][]) {
    for (const role of ROLES) {
      it(`${role} ${roles.includes(role) ? 'may' : 'may not'} ${permission}`, () => {
        expect(can(role, permission)).toBe(roles.includes(role))
      })
    }
  }

  it('gives nothing to a missing or unknown role', () => {
    expect(can(null, 'pieces:read')).toBe(false)
    expect(can(undefined, 'pieces:read')).toBe(false)
    expect(can('admin' as Role, 'pieces:read')).toBe(false)
  })
})

describe('navigation', () => {
  it('shows the owner every screen in the product order, Mailbox only in development', () => {
    expect(navItemsFor('owner').map(i => i.label)).toEqual(['Bench', 'Pieces', 'Sets', 'Review', 'Templates', 'Certificates', 'Team'])
    expect(navItemsFor('owner', { dev: true }).map(i => i.label)).toContain('Mailbox')
  })

  it('hides the Bench and Review from the office, and Review and Certificates from a benchmaker', () => {
    expect(navItemsFor('office').map(i => i.label)).toEqual(['Pieces', 'Sets', 'Templates', 'Certificates', 'Team'])
    expect(navItemsFor('benchmaker').map(i => i.label)).toEqual(['Bench', 'Pieces', 'Sets', 'Templates', 'Team'])
  })

  it('finds the permission of nested screen paths', () => {
    expect(permissionForPath('/review')).toBe('review:decide')
    expect(permissionForPath('/sets/123')).toBe('sets:read')
    expect(permissionForPath('/')).toBeUndefined()
    expect(permissionForPath('/benchmark')).toBeUndefined()
  })
})
