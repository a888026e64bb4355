import type { H3Event } from 'h3'
import { getCookie, getHeader } from 'h3'
import { z } from 'zod'
import { can, ROLE_LABELS, type Permission, type Role } from '../../shared/auth/roles'
import { fail } from './http-errors'
import { findSessionMember, type SessionMember } from './sessions'

export const TOKEN_COOKIE = 'auth.token'

/** The bearer token from the Authorization header or the sign-in cookie. */
export function readToken(event: H3Event): string | null {
  const header = getHeader(event, 'authorization')
  const raw = header ?? getCookie(event, TOKEN_COOKIE) ?? ''
  const token = decodeURIComponent(raw).replace(/^Bearer\s+/i, '').trim()
  return token.length > 0 && token.length < 200 ? token : null
}

export interface Member extends SessionMember {
  workshopId: string
  workshopName: string
  role: Role
}

const WorkshopHeader = z.string().uuid()

/** The signed-in user, or 401. */
export async function requireUser(event: H3Event): Promise<SessionMember> {
  const token = readToken(event)
  if (!token) fail(401, 'Sign in to continue.')
  const override = getHeader(event, 'x-workshop-id')
  if (override !== undefined && !WorkshopHeader.safeParse(override).success) fail(404, 'No such workshop.')
  const member = await findSessionMember(useDatabase(), token, useRuntimeConfig().authSecret, override)
  if (!member) fail(401, 'Your session has ended. Sign in again.')
  event.context.member = member
  return member
}

/**
 * Every API route starts here: the signed-in user, the workshop they act in and
 * their role there. 401 without a session, 404 for a workshop they do not belong
 * to (its existence is not revealed), 403 when the role lacks the permission.
 */
export async function requireMember(event: H3Event, permission?: Permission): Promise<Member> {
  const member = await requireUser(event)
  if (!member.workshopId || !member.role || !member.workshopName) fail(404, 'No such workshop.')
  if (permission && !can(member.role, permission)) {
    fail(403, `Your role here (${ROLE_LABELS[member.role].toLowerCase()}) does not allow this.`)
  }
  return member as Member
}
