import { and, asc, eq, sql } from 'drizzle-orm'
import { memberships, users } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { Role } from '../../shared/auth/roles'
import type { AddMemberInput } from '../../shared/schemas/auth'
import { audit } from './audit'
import { findUserByEmail } from './accounts'
import { fail } from './http-errors'
import { hashPassword } from './passwords'

export interface TeamMember {
  userId: string
  name: string
  email: string
  role: Role
  mustChangePassword: boolean
  since: Date
}

export async function listTeam(db: Executor, workshopId: string): Promise<TeamMember[]> {
  return db
    .select({
      userId: users.id, name: users.name, email: users.email, role: memberships.role,
      mustChangePassword: users.mustChangePassword, since: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workshopId, workshopId))
    .orderBy(asc(users.name))
}

/**
 * Adds a member. A new e-mail gets an account with the temporary password (to be
 * changed at first sign-in); an existing account simply joins this workshop and
 * keeps its own password.
 */
export async function addMember(db: Database, workshopId: string, actorId: string, input: AddMemberInput): Promise<TeamMember> {
  const passwordHash = await hashPassword(input.temporaryPassword)
  return db.transaction(async (tx) => {
    const user = await findUserByEmail(tx, input.email)
      ?? (await tx.insert(users).values({ name: input.name, email: input.email, passwordHash, mustChangePassword: true }).returning())[0]
    const [existing] = await tx.select({ id: memberships.id }).from(memberships)
      .where(and(eq(memberships.workshopId, workshopId), eq(memberships.userId, user!.id)))
    if (existing) fail(409, 'That person is already a member of this workshop.')
    const [membership] = await tx.insert(memberships).values({ workshopId, userId: user!.id, role: input.role }).returning()
    await audit(tx, { workshopId, actorId, action: 'member.add', subjectType: 'user', subjectId: user!.id, toState: input.role })
    return { userId: user!.id, name: user!.name, email: user!.email, role: input.role, mustChangePassword: user!.mustChangePassword, since: membership!.createdAt }
  })
}

/** Locks the workshop's memberships so two owners cannot demote each other at once. */
async function lockMemberships(tx: Executor, workshopId: string) {
  return tx.execute<{ user_id: string, role: Role }>(
    sql`select user_id, role from memberships where workshop_id = ${workshopId} for update`,
  )
}

export async function changeRole(db: Database, workshopId: string, actorId: string, userId: string, role: Role) {
  return db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, workshopId)
    const target = rows.find(r => r.user_id === userId)
    if (!target) fail(404, 'No such member in this workshop.')
    if (target.role === role) return { userId, role }
    const owners = rows.filter(r => r.role === 'owner').length
    if (target.role === 'owner' && owners <= 1) fail(409, 'A workshop needs at least one owner: make someone else owner first.')
    await tx.update(memberships).set({ role }).where(and(eq(memberships.workshopId, workshopId), eq(memberships.userId, userId)))
    await audit(tx, { workshopId, actorId, action: 'member.role', subjectType: 'user', subjectId: userId, fromState: target.role, toState: role })
    return { userId, role }
  })
}

export async function removeMember(db: Database, workshopId: string, actorId: string, userId: string) {
  return db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, workshopId)
    const target = rows.find(r => r.user_id === userId)
    if (!target) fail(404, 'No such member in this workshop.')
    const owners = rows.filter(r => r.role === 'owner').length
    if (target.role === 'owner' && owners <= 1) fail(409, 'The last owner cannot be removed: make someone else owner first.')
    await tx.delete(memberships).where(and(eq(memberships.workshopId, workshopId), eq(memberships.userId, userId)))
    await audit(tx, { workshopId, actorId, action: 'member.remove', subjectType: 'user', subjectId: userId, fromState: target.role })
    return { userId, removed: true }
  })
}
