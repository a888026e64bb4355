/** GET /api/health: 200 { ok, db } when PostgreSQL answers, 503 otherwise. */
export default defineEventHandler(async (event) => {
  const db = await databaseAnswers()
  if (!db) setResponseStatus(event, 503)
  return { ok: db, db }
})
