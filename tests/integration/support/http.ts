import { randomUUID } from 'node:crypto'

export const BASE_URL = process.env.TW_BASE_URL ?? 'http://127.0.0.1:3100'

export interface Reply<T = any> { status: number, body: T, headers: Headers }

let target = BASE_URL
/** Points every helper of this module at another server (the two-instance test's first instance). */
export function useServer(baseUrl: string) {
  target = baseUrl
}

/** A JSON request against the running test server (or `baseUrl`, or the one `useServer` chose). */
export async function api<T = any>(path: string, options: { method?: string, body?: unknown, token?: string, headers?: Record<string, string>, baseUrl?: string } = {}): Promise<Reply<T>> {
  const headers: Record<string, string> = { accept: 'application/json', ...options.headers }
  if (options.token) headers.authorization = `Bearer ${options.token}`
  let body: BodyInit | undefined
  if (options.body instanceof FormData) body = options.body
  else if (options.body !== undefined) {
    headers['content-type'] = 'application/json'
    body = JSON.stringify(options.body)
  }
  const response = await fetch(`${options.baseUrl ?? target}${path}`, { method: options.method ?? 'GET', headers, body })
  const text = await response.text()
  let parsed: unknown = text
  try {
    parsed = text ? JSON.parse(text) : null
  }
  catch { /* not JSON: keep the text */ }
  return { status: response.status, body: parsed as T, headers: response.headers }
}

export function uniqueEmail(prefix = 'user') {
  return `${prefix}-${randomUUID().slice(0, 8)}@example.test`
}

/** Signs up a fresh workshop and returns its owner's token and ids. */
export async function newWorkshop(name = 'Test workshop') {
  const email = uniqueEmail('owner')
  const password = 'correct-horse-battery'
  const reply = await api('/api/auth/signup', { method: 'POST', body: { name: 'Test Owner', email, password, workshopName: name } })
  if (reply.status !== 200) throw new Error(`sign-up failed: ${reply.status} ${JSON.stringify(reply.body)}`)
  const session = await api('/api/auth/session', { token: reply.body.token })
  return { token: reply.body.token as string, workshopId: reply.body.workshopId as string, userId: session.body.id as string, email, password }
}

export async function signIn(email: string, password: string) {
  const reply = await api('/api/auth/login', { method: 'POST', body: { email, password } })
  if (reply.status !== 200) throw new Error(`sign-in failed: ${reply.status} ${JSON.stringify(reply.body)}`)
  return reply.body.token as string
}

export const TEMPORARY_PASSWORD = 'temporary-pass-123'
export const MEMBER_PASSWORD = 'members-own-password-1'

/**
 * Adds a member (a new address) with a role and a temporary password and signs them
 * in, still on the temporary password: the server lets them read the session and
 * change the password, nothing else.
 */
export async function memberOnTemporaryPassword(ownerToken: string, role: string) {
  const email = uniqueEmail(role)
  const added = await api('/api/team', { method: 'POST', token: ownerToken, body: { name: `A ${role}`, email, role, temporaryPassword: TEMPORARY_PASSWORD } })
  if (added.status !== 201) throw new Error(`add member failed: ${added.status} ${JSON.stringify(added.body)}`)
  // The answer to an add does not carry the account's id (it is the same for an existing account); the session does.
  const token = await signIn(email, TEMPORARY_PASSWORD)
  const session = await api('/api/auth/session', { token })
  return { token, userId: session.body.id as string, email, temporaryPassword: TEMPORARY_PASSWORD }
}

/** Adds a member with a role, signs them in and chooses their own password (MEMBER_PASSWORD), as the app asks first. */
export async function memberWithRole(ownerToken: string, role: string) {
  const member = await memberOnTemporaryPassword(ownerToken, role)
  const changed = await api('/api/auth/password', { method: 'POST', token: member.token, body: { currentPassword: TEMPORARY_PASSWORD, newPassword: MEMBER_PASSWORD } })
  if (changed.status !== 200) throw new Error(`password change failed: ${changed.status} ${JSON.stringify(changed.body)}`)
  return { token: member.token, userId: member.userId, email: member.email, password: MEMBER_PASSWORD }
}
