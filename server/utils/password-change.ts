import { and, eq, ne } from 'drizzle-orm'
import { sessions, users } from '../database/schema'
import type { Database } from '../database/client'
import { fail } from './http-errors'
import { checkPassword, hashPassword } from './passwords'

/** Sets a new password after checking the current one; other devices are signed out. */
export async function changePassword(db: Database, userId: string, sessionId: string, currentPassword: string, newPassword: string) {
  const [user] = await db.select().from(users).where(eq(users.id, userId))
  if (!user || !(await checkPassword(currentPassword, user.passwordHash))) fail(400, 'currentPassword: That is not your current password.')
  const passwordHash = await hashPassword(newPassword)
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash, mustChangePassword: false }).where(eq(users.id, userId))
    await tx.delete(sessions).where(and(eq(sessions.userId, userId), ne(sessions.id, sessionId)))
  })
  return { ok: true }
}
