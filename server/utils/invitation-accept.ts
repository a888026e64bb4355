import { and, eq, gt, isNull } from 'drizzle-orm'
import { invitations, memberships, users, workshops, type Invitation } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { rolesAssignableBy } from '../../shared/auth/roles'
import { audit } from './audit'
import { findUserByEmail } from './accounts'
import { MUST_CHANGE_PASSWORD } from './auth'
import { conflictOnDuplicate, fail } from './http-errors'
import { hashPassword } from './passwords'
import { hashToken, type SessionMember } from './sessions'

const GONE = 'This invitation link has expired or was already used, or it was revoked. Ask the workshop owner for a new one.'

async function openInvitation(db: Executor, token: string, secret: string, lock: boolean) {
  const query = db.select({ invitation: invitations, workshopName: workshops.name }).from(invitations)
    .innerJoin(workshops, eq(workshops.id, invitations.workshopId))
    .where(and(
      eq(invitations.tokenHash, hashToken(token, secret)), isNull(invitations.usedAt), isNull(invitations.revokedAt),
      gt(invitations.expiresAt, new Date()),
    ))
  const [row] = lock ? await query.for('update', { of: invitations }) : await query
  if (!row) fail(404, GONE)
  return row
}

/**
 * The invitation holds only while its inviter may still give its role, checked now
 * (not when it was sent). With `lock` the inviter's membership is share-locked, so a
 * demotion or removal waits until this acceptance is done, or wins before it.
 */
async function inviterStillMayGive(db: Executor, invitation: Invitation, lock: boolean) {
  if (!invitation.invitedBy) return false
  const query = db.select({ role: memberships.role }).from(memberships)
    .where(and(eq(memberships.workshopId, invitation.workshopId), eq(memberships.userId, invitation.invitedBy)))
  const [row] = lock ? await query.for('share') : await query
  return rolesAssignableBy(row?.role).includes(invitation.role)
}

/** What the accept page shows before the person chooses a password or joins. */
export async function lookupInvitation(db: Executor, token: string, secret: string) {
  const { invitation, workshopName } = await openInvitation(db, token, secret, false)
  if (!(await inviterStillMayGive(db, invitation, false))) fail(404, GONE)
  const account = await findUserByEmail(db, invitation.email)
  return { workshopName, email: invitation.email, name: invitation.name, role: invitation.role, hasAccount: Boolean(account), expiresAt: invitation.expiresAt }
}

export interface AcceptInput { token: string, name?: string, password?: string }

/**
 * Accepts an invitation once, with the role its inviter may give at this moment.
 * A new e-mail gets an account with the chosen password; an address that already
 * has an account joins only while signed in as that account, so nobody is linked
 * to a workshop without saying yes themselves.
 */
export async function acceptInvitation(db: Database, input: AcceptInput, signedIn: SessionMember | null, secret: string) {
  const work = () => db.transaction(async (tx) => {
    // The inviter's membership before the invitation: the order in which changeRole and removeMember lock.
    const first = await openInvitation(tx, input.token, secret, false)
    if (!(await inviterStillMayGive(tx, first.invitation, true))) fail(404, GONE)
    const { invitation } = await openInvitation(tx, input.token, secret, true)
    const existing = await findUserByEmail(tx, invitation.email)
    let userId: string
    if (existing) {
      if (!signedIn) fail(401, 'An account with this e-mail already exists: sign in with it, then open the link again to accept.')
      if (signedIn.userId !== existing.id) fail(403, 'This invitation is for another e-mail address: sign in with that address to accept it.')
      if (signedIn.mustChangePassword) fail(403, MUST_CHANGE_PASSWORD)
      userId = existing.id
    }
    else {
      if (!input.name || !input.password) fail(400, 'Enter your name and choose a password.')
      const passwordHash = await hashPassword(input.password)
      const [user] = await tx.insert(users).values({ name: input.name, email: invitation.email, passwordHash }).returning({ id: users.id })
      userId = user!.id
    }
    const [already] = await tx.select({ id: memberships.id }).from(memberships)
      .where(and(eq(memberships.workshopId, invitation.workshopId), eq(memberships.userId, userId)))
    if (already) fail(409, 'You are already a member of this workshop.')
    await tx.insert(memberships).values({ workshopId: invitation.workshopId, userId, role: invitation.role })
    await tx.update(invitations).set({ usedAt: new Date() }).where(eq(invitations.id, invitation.id))
    await audit(tx, { workshopId: invitation.workshopId, actorId: userId, action: 'member.join', subjectType: 'user', subjectId: userId, toState: invitation.role, details: { invitationId: invitation.id } })
    return { email: invitation.email, workshopId: invitation.workshopId, role: invitation.role }
  })
  // Two invitations accepted at once by one person, or one new address accepted twice: the indexes decide.
  return conflictOnDuplicate(
    () => conflictOnDuplicate(work, 'You are already a member of this workshop.', 'memberships_workshop_user_key'),
    'An account with this e-mail was just created: sign in with it, then open the link again.', 'users_email_key',
  )
}
