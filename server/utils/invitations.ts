import { and, asc, eq, gt, isNull, notInArray, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { invitations, memberships, users } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { ROLE_LABELS, rolesAssignableBy, type Role } from '../../shared/auth/roles'
import type { Member } from './auth'
import { audit } from './audit'
import { findUserByEmail } from './accounts'
import { fail } from './http-errors'
import { invitationMail, queueMail } from './mail'
import { hashToken, newToken } from './sessions'

export const INVITATION_DAYS = 7
export const ALREADY_MEMBER = 'That person is already a member of this workshop.'

export interface InvitationInput { name: string, email: string, role: Role }

/** Adds and invitations of one address to one workshop queue here, so two cannot cross. */
export async function lockAddress(tx: Executor, workshopId: string, email: string) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`team:${workshopId}:${email.toLowerCase()}`}))`)
}

/** The pending invitations of a workshop: not accepted, not revoked, not expired. */
const pending = (workshopId: string) => and(
  eq(invitations.workshopId, workshopId), isNull(invitations.usedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date()),
)

/**
 * Queues a single-use link for this address, inside the caller's transaction (which
 * holds lockAddress). One live invitation per address: an older one stops working.
 */
export async function inviteInTransaction(tx: Executor, member: Member, input: InvitationInput, siteUrl: string, secret: string) {
  const existing = await findUserByEmail(tx, input.email)
  if (existing) {
    const [m] = await tx.select({ id: memberships.id }).from(memberships)
      .where(and(eq(memberships.workshopId, member.workshopId), eq(memberships.userId, existing.id)))
    if (m) fail(409, ALREADY_MEMBER)
  }
  await tx.update(invitations).set({ revokedAt: new Date(), revokedBy: member.userId })
    .where(and(pending(member.workshopId), sql`lower(${invitations.email}) = ${input.email.toLowerCase()}`))
  const token = newToken()
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000)
  const [invitation] = await tx.insert(invitations).values({
    workshopId: member.workshopId, email: input.email, name: input.name, role: input.role,
    tokenHash: hashToken(token, secret), invitedBy: member.userId, expiresAt,
  }).returning()
  const link = `${siteUrl.replace(/\/+$/, '')}/join?token=${token}`
  await queueMail(tx, {
    workshopId: member.workshopId, kind: 'invitation', to: input.email, requestedBy: member.userId,
    ...invitationMail({ workshopName: member.workshopName, inviterName: member.name, role: ROLE_LABELS[input.role], link, expiresAt, hasAccount: Boolean(existing) }),
  })
  await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'member.invite', subjectType: 'invitation', subjectId: invitation!.id, toState: input.role, details: { email: input.email } })
  return { id: invitation!.id, email: invitation!.email, role: invitation!.role, expiresAt }
}

/** Invites someone by e-mail: a single-use link that expires in a week. */
export async function createInvitation(db: Database, member: Member, input: InvitationInput, siteUrl: string, secret: string) {
  return db.transaction(async (tx) => {
    await lockAddress(tx, member.workshopId, input.email)
    return inviteInTransaction(tx, member, input, siteUrl, secret)
  })
}

/** The Team screen's list of invitations still waiting for an answer. */
export async function listPendingInvitations(db: Executor, workshopId: string) {
  const inviter = alias(users, 'inviter')
  return db.select({
    id: invitations.id, email: invitations.email, name: invitations.name, role: invitations.role,
    invitedBy: inviter.name, createdAt: invitations.createdAt, expiresAt: invitations.expiresAt,
  }).from(invitations)
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(pending(workshopId))
    .orderBy(asc(invitations.createdAt))
}

/** Revokes one pending invitation of this workshop (404 for another workshop's, 409 when no longer pending). */
export async function revokeInvitation(db: Database, workshopId: string, actorId: string, id: string) {
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(invitations)
      .where(and(eq(invitations.id, id), eq(invitations.workshopId, workshopId))).for('update')
    if (!row) fail(404, 'No such invitation in this workshop.')
    if (row.usedAt) fail(409, 'That invitation was already accepted: remove the member instead.')
    if (row.revokedAt) fail(409, 'That invitation was already revoked.')
    await tx.update(invitations).set({ revokedAt: new Date(), revokedBy: actorId }).where(eq(invitations.id, id))
    await audit(tx, { workshopId, actorId, action: 'invitation.revoke', subjectType: 'invitation', subjectId: id, fromState: 'pending', toState: 'revoked', details: { email: row.email } })
    return { id, revoked: true }
  })
}

/**
 * When a member loses the right to give a role (removed: `role` null, or demoted),
 * their pending invitations for it die with it, in the caller's transaction.
 */
export async function revokeInvitationsFrom(tx: Executor, workshopId: string, actorId: string, inviterId: string, role: Role | null, reason: string) {
  const still = rolesAssignableBy(role)
  const revoked = await tx.update(invitations).set({ revokedAt: new Date(), revokedBy: actorId })
    .where(and(
      eq(invitations.workshopId, workshopId), eq(invitations.invitedBy, inviterId), isNull(invitations.usedAt), isNull(invitations.revokedAt),
      still.length > 0 ? notInArray(invitations.role, [...still]) : undefined,
    ))
    .returning({ id: invitations.id })
  for (const { id } of revoked) {
    await audit(tx, { workshopId, actorId, action: 'invitation.revoke', subjectType: 'invitation', subjectId: id, fromState: 'pending', toState: 'revoked', reason })
  }
}
