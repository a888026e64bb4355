import type { H3Event } from 'h3'
import { getCookie, getHeader } from 'h3'
import { z } from 'zod'
import { can, ROLE_LABELS, type Permission, type Role } from '../../shared/auth/roles'
import { fail } from './http-errors'
import { findSessionMember, type SessionMember } from './sessions'

export const TOKEN_COOKIE = 'auth.token'

// Our tokens are 43 base64url characters (server/utils/sessions.ts newToken); a little slack for the future.
const TOKEN_SHAPE = /^[\w-]{20,200}$/
const BEARER = /^Bearer[ \t]+(\S+)[ \t]*$/i

/** Percent-decoding that answers null instead of throwing on a malformed sequence. */
function safeDecode(value: string): string | null {
  try {
    return decodeURIComponent(value)
  }
  catch {
    return null
  }
}

/**
 * The bearer token from the Authorization header or the sign-in cookie, or null
 * for anything that is not one: another scheme, a malformed or oversized value.
 * Nothing here throws, so a hostile header answers 401 like a missing one.
 */
export function readToken(event: H3Event): string | null {
  const header = getHeader(event, 'authorization')
  // The client keeps "Bearer <token>" in the cookie, percent-encoded.
  const raw = header ?? safeDecode(getCookie(event, TOKEN_COOKIE) ?? '') ?? ''
  if (raw.length > 300) return null
  const token = BEARER.exec(raw.trim())?.[1] ?? (header === undefined ? raw.trim() : '')
  return TOKEN_SHAPE.test(token) ? token : null
}

export interface Member extends SessionMember {
  workshopId: string
  workshopName: string
  role: Role
}

const WorkshopHeader = z.string().uuid()

export const MUST_CHANGE_PASSWORD = 'Choose your own password first: you signed in with a temporary one.'

/**
 * The signed-in user, or 401. An account still on a temporary password gets 403
 * everywhere except where `allowTemporaryPassword` is set (reading the session and
 * changing the password): the server enforces it, not only the browser.
 */
export async function requireUser(event: H3Event, options: { allowTemporaryPassword?: boolean } = {}): Promise<SessionMember> {
  const token = readToken(event)
  if (!token) fail(401, 'Sign in to continue.')
  const override = getHeader(event, 'x-workshop-id')
  if (override !== undefined && !WorkshopHeader.safeParse(override).success) fail(404, 'No such workshop.')
  const member = await findSessionMember(useDatabase(), token, useRuntimeConfig().authSecret, override)
  if (!member) fail(401, 'Your session has ended. Sign in again.')
  if (member.mustChangePassword && !options.allowTemporaryPassword) fail(403, MUST_CHANGE_PASSWORD)
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

/** The signed-in user on a public route, or null (an ended session counts as none). */
export async function optionalUser(event: H3Event): Promise<SessionMember | null> {
  const token = readToken(event)
  return token ? findSessionMember(useDatabase(), token, useRuntimeConfig().authSecret) : null
}
