/** POST /api/auth/logout: ends this session (harmless when already ended). */
export default defineEventHandler(async (event) => {
  const token = readToken(event)
  if (token) await deleteSession(useDatabase(), token, useRuntimeConfig().authSecret)
  deleteCookie(event, TOKEN_COOKIE)
  return { ok: true }
})
