/**
 * GET /api/ready: 200 { ready, db, storage } when this instance can serve (PostgreSQL and
 * the object store answer), 503 otherwise, so a load balancer sends it no traffic.
 * `/api/health` stays the liveness check (the process and its database).
 */
export default defineEventHandler(async (event) => {
  const [db, storage] = await Promise.all([databaseAnswers(), storageAnswers(useBlobStorage())])
  if (!db || !storage) setResponseStatus(event, 503)
  return { ready: db && storage, db, storage }
})
