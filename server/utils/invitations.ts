import { and, eq, gt, isNull } from 'drizzle-orm'
import { invitations, memberships, users, workshops } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { ROLE_LABELS, type Role } from '../../shared/auth/roles'
import type { Member } from './auth'
import { audit } from './audit'
import { findUserByEmail } from './accounts'
import { fail } from './http-errors'
import { invitationMail, queueMail } from './mail'
import { checkPassword, hashPassword } from './passwords'
import { hashToken, newToken } from './sessions'

export const INVITATION_DAYS = 7
const GONE = 'This invitation link has expired or was already used. Ask the workshop owner for a new one.'

/** Invites someone by e-mail: a single-use sign-up link that expires in a week. */
export async function createInvitation(db: Database, member: Member, input: { name: string, email: string, role: Role }, siteUrl: string, secret: string) {
  return db.transaction(async (tx) => {
    const existing = await findUserByEmail(tx, input.email)
    if (existing) {
      const [m] = await tx.select({ id: memberships.id }).from(memberships)
        .where(and(eq(memberships.workshopId, member.workshopId), eq(memberships.userId, existing.id)))
      if (m) fail(409, 'That person is already a member of this workshop.')
    }
    const token = newToken()
    const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000)
    const [invitation] = await tx.insert(invitations).values({
      workshopId: member.workshopId, email: input.email, name: input.name, role: input.role,
      tokenHash: hashToken(token, secret), invitedBy: member.userId, expiresAt,
    }).returning()
    const link = `${siteUrl.replace(/\/+$/, '')}/join?token=${token}`
    await queueMail(tx, {
      workshopId: member.workshopId, kind: 'invitation', to: input.email, requestedBy: member.userId,
      ...invitationMail({ workshopName: member.workshopName, inviterName: member.name, role: ROLE_LABELS[input.role], link, expiresAt }),
    })
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'member.invite', subjectType: 'invitation', subjectId: invitation!.id, toState: input.role, details: { email: input.email } })
    return { id: invitation!.id, email: invitation!.email, role: invitation!.role, expiresAt }
  })
}

async function openInvitation(db: Executor, token: string, secret: string, lock: boolean) {
  const query = db.select({ invitation: invitations, workshopName: workshops.name }).from(invitations)
    .innerJoin(workshops, eq(workshops.id, invitations.workshopId))
    .where(and(eq(invitations.tokenHash, hashToken(token, secret)), isNull(invitations.usedAt), gt(invitations.expiresAt, new Date())))
  const [row] = lock ? await query.for('update', { of: invitations }) : await query
  if (!row) fail(404, GONE)
  return row
}

/** What the accept page shows before the person chooses a password. */
export async function lookupInvitation(db: Executor, token: string, secret: string) {
  const { invitation, workshopName } = await openInvitation(db, token, secret, false)
  const account = await findUserByEmail(db, invitation.email)
  return { workshopName, email: invitation.email, name: invitation.name, role: invitation.role, hasAccount: Boolean(account), expiresAt: invitation.expiresAt }
}

/**
 * Accepts an invitation once. A new e-mail gets an account with the chosen
 * password; an existing account must give its own password and simply joins.
 */
export async function acceptInvitation(db: Database, input: { token: string, name: string, password: string }, secret: string) {
  const passwordHash = await hashPassword(input.password)
  return db.transaction(async (tx) => {
    const { invitation } = await openInvitation(tx, input.token, secret, true)
    const existing = await findUserByEmail(tx, invitation.email)
    if (existing && !(await checkPassword(input.password, existing.passwordHash))) {
      fail(401, 'An account with this e-mail already exists: enter its password to join.')
    }
    const user = existing ?? (await tx.insert(users).values({ name: input.name, email: invitation.email, passwordHash }).returning())[0]
    const [already] = await tx.select({ id: memberships.id }).from(memberships)
      .where(and(eq(memberships.workshopId, invitation.workshopId), eq(memberships.userId, user!.id)))
    if (!already) await tx.insert(memberships).values({ workshopId: invitation.workshopId, userId: user!.id, role: invitation.role })
    await tx.update(invitations).set({ usedAt: new Date() }).where(eq(invitations.id, invitation.id))
    await audit(tx, { workshopId: invitation.workshopId, actorId: user!.id, action: 'member.join', subjectType: 'user', subjectId: user!.id, toState: invitation.role, details: { invitationId: invitation.id } })
    return { email: user!.email, workshopId: invitation.workshopId, role: invitation.role }
  })
}
