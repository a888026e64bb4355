import { and, asc, eq, sql } from 'drizzle-orm'
import { memberships, users } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { Role } from '../../shared/auth/roles'
import type { AddMemberInput } from '../../shared/schemas/auth'
import { audit } from './audit'
import { findUserByEmail } from './accounts'
import type { Member } from './auth'
import { conflictOnDuplicate, fail, isUniqueViolation } from './http-errors'
import { ALREADY_MEMBER, inviteInTransaction, lockAddress, revokeInvitationsFrom } from './invitations'
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

/** The answer to an add: the same for a new address and one that already has an account. */
export interface AddMemberReply { email: string, name: string, role: Role, message: string }

export const ADD_MEMBER_ANSWER = 'Done. A new address can sign in now with the temporary password and chooses its own at first sign-in; '
  + 'an address that already has a Tonewright account gets an invitation to accept instead, and keeps its own password.'

/**
 * Adds a member. A new e-mail gets an account with the temporary password (to be
 * changed at first sign-in) and joins at once. An address that already has an
 * account is never linked silently: it gets an invitation to accept while signed
 * in. The reply is the same in both cases and shows nothing of the account (its
 * name, its id); see DEVELOPERS.md, "Adding members", for what an owner can still infer.
 */
export async function addMember(db: Database, member: Member, input: AddMemberInput, siteUrl: string, secret: string): Promise<AddMemberReply> {
  const { workshopId, userId: actorId } = member
  // Hashed in both cases, so the answer takes about as long either way.
  const passwordHash = await hashPassword(input.temporaryPassword)
  const add = () => db.transaction(async (tx) => {
    await lockAddress(tx, workshopId, input.email)
    if (await findUserByEmail(tx, input.email)) {
      await inviteInTransaction(tx, member, { name: input.name, email: input.email, role: input.role }, siteUrl, secret)
      return
    }
    const [user] = await tx.insert(users).values({ name: input.name, email: input.email, passwordHash, mustChangePassword: true }).returning()
    await tx.insert(memberships).values({ workshopId, userId: user!.id, role: input.role })
    await audit(tx, { workshopId, actorId, action: 'member.add', subjectType: 'user', subjectId: user!.id, toState: input.role })
  })
  await conflictOnDuplicate(async () => {
    try {
      await add()
    }
    catch (error) {
      // Someone else (another workshop, a sign-up) created this account a moment ago: now it gets an invitation.
      if (!isUniqueViolation(error, 'users_email_key')) throw error
      await add()
    }
  }, ALREADY_MEMBER)
  return { email: input.email, name: input.name, role: input.role, message: ADD_MEMBER_ANSWER }
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
    await revokeInvitationsFrom(tx, workshopId, actorId, userId, role, 'The inviter may no longer give this role.')
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
    await revokeInvitationsFrom(tx, workshopId, actorId, userId, null, 'The inviter left the workshop.')
    await audit(tx, { workshopId, actorId, action: 'member.remove', subjectType: 'user', subjectId: userId, fromState: target.role })
    return { userId, removed: true }
  })
}
