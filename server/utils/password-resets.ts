import { and, count, eq, gt, isNull } from 'drizzle-orm'
import { passwordResets, sessions, users } from '../database/schema'
import type { Database } from '../database/client'
import { findUserByEmail } from './accounts'
import { fail } from './http-errors'
import { passwordResetMail, queueMail } from './mail'
import { hashPassword } from './passwords'
import { hashToken, newToken } from './sessions'

export const RESET_MINUTES = 60
export const RESETS_PER_HOUR = 3
export const RESET_ANSWER = 'If an account uses that address, we have sent it a link to reset the password. The link works once, for an hour.'

/** Queues a reset link for a known address; says the same, in about the same time, for an unknown one. */
export async function requestPasswordReset(db: Database, email: string, siteUrl: string, secret: string) {
  await db.transaction(async (tx) => {
    const user = await findUserByEmail(tx, email)
    if (!user) return
    // Parallel requests for one account queue here, so the count below cannot be outrun.
    await tx.select({ id: users.id }).from(users).where(eq(users.id, user.id)).for('update')
    // At most three links an hour per account, so nobody can flood someone's inbox; the answer stays the same.
    const [recent] = await tx.select({ n: count() }).from(passwordResets)
      .where(and(eq(passwordResets.userId, user.id), gt(passwordResets.createdAt, new Date(Date.now() - 3600_000))))
    if ((recent?.n ?? 0) >= RESETS_PER_HOUR) return
    const token = newToken()
    const expiresAt = new Date(Date.now() + RESET_MINUTES * 60 * 1000)
    // One live link at a time: an older unused one stops working.
    await tx.update(passwordResets).set({ usedAt: new Date() }).where(and(eq(passwordResets.userId, user.id), isNull(passwordResets.usedAt)))
    await tx.insert(passwordResets).values({ userId: user.id, tokenHash: hashToken(token, secret), expiresAt })
    const link = `${siteUrl.replace(/\/+$/, '')}/reset-password?token=${token}`
    await queueMail(tx, { workshopId: null, kind: 'password-reset', to: user.email, ...passwordResetMail({ name: user.name, link, expiresAt }) })
  })
  return { message: RESET_ANSWER }
}

/** Sets a new password with a live link, once; every session of the account ends. */
export async function resetPassword(db: Database, input: { token: string, password: string }, secret: string) {
  return db.transaction(async (tx) => {
    const [reset] = await tx.select().from(passwordResets)
      .where(and(eq(passwordResets.tokenHash, hashToken(input.token, secret)), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
      .for('update')
    if (!reset) fail(400, 'This reset link has expired or was already used. Ask for a new one.')
    // Hashed only for a live link, so a made-up token costs the server no hashing.
    const passwordHash = await hashPassword(input.password)
    await tx.update(passwordResets).set({ usedAt: new Date() }).where(eq(passwordResets.id, reset.id))
    await tx.update(users).set({ passwordHash, mustChangePassword: false }).where(eq(users.id, reset.userId))
    await tx.delete(sessions).where(eq(sessions.userId, reset.userId))
    const [user] = await tx.select({ email: users.email }).from(users).where(eq(users.id, reset.userId))
    return { email: user!.email }
  })
}
