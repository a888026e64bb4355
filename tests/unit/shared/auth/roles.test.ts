import { describe, expect, it } from 'vitest'
import { can, navItemsFor, PERMISSIONS, permissionForPath, ROLES, type Permission, type Role } from '../../../../shared/auth/roles'

// The expected rights come from the role table in README.md ("Roles and stages"), written
// out here by role, as that table reads, so that a change to the code's table by permission
// has to be made twice on purpose.
const reads: Permission[] = ['workshop:read', 'team:read', 'templates:read', 'pieces:read', 'sets:read']
const benchmakerRights: Permission[] = [...reads, 'pieces:stage', 'bench:strike']
// Re-measuring stored strikes is a supervisor's call (issue 10: "a supervisor can re-measure"), and the owner's.
// A set's results as CSV (issue 13, "for the workshop's own spreadsheets") go to those who read certificates, not to the bench.
const supervisorRights: Permission[] = [...benchmakerRights, 'pieces:assign', 'review:decide', 'strikes:reanalyze', 'certificates:read', 'certificates:sign', 'sets:export']
const officeRights: Permission[] = [...reads, 'certificates:read', 'sets:manage', 'sets:ship', 'lots:manage', 'certificates:send', 'sets:export']
const ownerOnly: Permission[] = ['workshop:manage', 'team:manage', 'templates:manage']
const everyPermission = Object.keys(PERMISSIONS) as Permission[]
const expected: Record<Role, Permission[]> = {
  owner: everyPermission, // "may do everything"
  supervisor: supervisorRights,
  benchmaker: benchmakerRights,
  office: officeRights,
}

describe('can', () => {
  it('knows no right the role table leaves out', () => {
    const named = new Set([...ownerOnly, ...supervisorRights, ...officeRights])
    expect([...everyPermission].sort()).toEqual([...named].sort())
  })

  for (const role of ROLES) {
    for (const permission of everyPermission) {
      const may = expected[role].includes(permission)
      it(`${role} ${may ? 'may' : 'may not'} ${permission}`, () => {
        expect(can(role, permission)).toBe(may)
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
    expect(navItemsFor('owner').map(i => i.label)).toEqual(['Bench', 'Pieces', 'Sets', 'Lots', 'Review', 'Templates', 'Certificates', 'Team', 'Settings'])
    expect(navItemsFor('owner', { dev: true }).map(i => i.label)).toContain('Mailbox')
  })

  it('hides the Bench and Review from the office, and Review and Certificates from a benchmaker', () => {
    expect(navItemsFor('office').map(i => i.label)).toEqual(['Pieces', 'Sets', 'Lots', 'Templates', 'Certificates', 'Team'])
    expect(navItemsFor('benchmaker').map(i => i.label)).toEqual(['Bench', 'Pieces', 'Sets', 'Lots', 'Templates', 'Team'])
  })

  it('finds the permission of nested screen paths', () => {
    expect(permissionForPath('/review')).toBe('review:decide')
    expect(permissionForPath('/sets/123')).toBe('sets:read')
    // Benchmakers record their inputs' reference tones under Settings, which only the owner opens otherwise.
    expect(permissionForPath('/settings/calibrations')).toBe('bench:strike')
    expect(permissionForPath('/settings')).toBe('workshop:manage')
    expect(permissionForPath('/')).toBeUndefined()
    expect(permissionForPath('/benchmark')).toBeUndefined()
  })
})
